import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { RouterLink } from '@angular/router';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatTableModule } from '@angular/material/table';
import { SessionStore } from '../session/session-store';
import { problemMessage } from '../session/problem-message';
import { SCREEN_ROLES } from '../accounts/screen-roles';
import { ClientsApi, type Client } from './clients-api';

/** The lab's clients: who sends radios and receives the reports. */
@Component({
  selector: 'sc-clients-page',
  imports: [RouterLink, FormsModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatProgressBarModule, MatTableModule],
  templateUrl: './clients-page.html',
  styles: `.table-card { padding: 0; overflow: hidden; position: relative; } table { width: 100%; } .small { font-size: 12px; } .search { width: min(420px, 100%); }`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ClientsPage {
  private readonly api = inject(ClientsApi);
  protected readonly session = inject(SessionStore);

  protected readonly canWrite = this.session.hasRole(...SCREEN_ROLES.labRecordsWrite);
  protected readonly columns = ['name', 'contact', 'portal', 'actions'];
  protected readonly rows = signal<Client[]>([]);
  protected readonly loading = signal(true);
  protected readonly error = signal<string | null>(null);
  protected search = '';

  constructor() {
    this.load();
  }

  load(): void {
    this.loading.set(true);
    this.error.set(null);
    this.api.list({ search: this.search.trim(), sort: 'name' }).subscribe({
      next: (page) => {
        this.rows.set(page.items);
        this.loading.set(false);
      },
      error: (error) => {
        this.error.set(problemMessage(error));
        this.loading.set(false);
      },
    });
  }
}
