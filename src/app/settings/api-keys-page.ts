import { ChangeDetectionStrategy, Component, inject, signal, viewChild } from '@angular/core';
import { DatePipe } from '@angular/common';
import { FormGroupDirective, NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { Clipboard } from '@angular/cdk/clipboard';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatTableModule } from '@angular/material/table';
import { problemMessage } from '../session/problem-message';
import { ApiKeysApi, type ApiKeyRow, type NewApiKey } from './api-keys-api';

/**
 * The lab's API keys for bench automation. A new key is shown once, with a copy button: the
 * server keeps only its hash, so it cannot be shown again.
 */
@Component({
  selector: 'sc-api-keys-page',
  imports: [DatePipe, ReactiveFormsModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatProgressBarModule, MatTableModule],
  templateUrl: './api-keys-page.html',
  styleUrls: ['./settings-section.scss', './api-keys-page.scss'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ApiKeysPage {
  private readonly api = inject(ApiKeysApi);
  private readonly clipboard = inject(Clipboard);

  protected readonly keys = signal<ApiKeyRow[]>([]);
  protected readonly created = signal<NewApiKey | null>(null);
  protected readonly copied = signal(false);
  protected readonly loading = signal(true);
  protected readonly busy = signal(false);
  protected readonly error = signal<string | null>(null);
  protected readonly columns = ['name', 'prefix', 'createdAt', 'lastUsedAt', 'state', 'actions'];
  private readonly formDirective = viewChild.required(FormGroupDirective);
  protected readonly form = inject(NonNullableFormBuilder).group({ name: ['', [Validators.required, Validators.maxLength(100), Validators.pattern(/\S/)]] });

  constructor() {
    this.load();
  }

  load(): void {
    this.loading.set(true);
    this.error.set(null);
    this.api.list().subscribe({
      next: (page) => {
        this.keys.set(page.items);
        this.loading.set(false);
      },
      error: (error) => {
        this.error.set(problemMessage(error));
        this.loading.set(false);
      },
    });
  }

  create(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.busy.set(true);
    this.error.set(null);
    this.copied.set(false);
    this.api.create(this.form.getRawValue().name.trim()).subscribe({
      next: (key) => {
        this.created.set(key);
        this.busy.set(false);
        this.formDirective().resetForm();
        this.load();
      },
      error: (error) => {
        this.error.set(problemMessage(error));
        this.busy.set(false);
      },
    });
  }

  copy(key: string): void {
    this.copied.set(this.clipboard.copy(key));
  }

  /** Forget the shown key: from here on only its prefix is known. */
  dismiss(): void {
    this.created.set(null);
  }

  revoke(row: ApiKeyRow): void {
    if (!confirm(`Revoke the key "${row.name}" (${row.prefix}…)? Bench scripts using it stop working at once.`)) return;
    this.api.revoke(row.id).subscribe({ next: () => this.load(), error: (error) => this.error.set(problemMessage(error)) });
  }
}
