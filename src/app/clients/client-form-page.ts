import { ChangeDetectionStrategy, Component, OnInit, computed, inject, input, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { Router, RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { SessionStore } from '../session/session-store';
import { problemMessage } from '../session/problem-message';
import { clearServerErrors, showProblemOnForm } from '../session/show-problem-on-form';
import { addressLines } from '../accounts/address-lines';
import { ClientsApi, type Client } from './clients-api';

/** Add a client (/clients/new) or change one (/clients/:id/edit); a lab admin can invite its administrator. */
@Component({
  selector: 'sc-client-form-page',
  imports: [ReactiveFormsModule, RouterLink, MatButtonModule, MatCheckboxModule, MatFormFieldModule, MatIconModule, MatInputModule, MatProgressBarModule],
  templateUrl: './client-form-page.html',
  styles: `.spacer { flex: 1; }`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ClientFormPage implements OnInit {
  private readonly api = inject(ClientsApi);
  private readonly router = inject(Router);
  protected readonly session = inject(SessionStore);

  /** Present when editing (route parameter). */
  readonly id = input<string>();

  protected readonly editing = computed(() => !!this.id());
  protected readonly client = signal<Client | null>(null);
  protected readonly loading = signal(false);
  protected readonly busy = signal(false);
  protected readonly error = signal<string | null>(null);
  protected readonly notice = signal<string | null>(null);
  protected readonly form = inject(NonNullableFormBuilder).group({
    name: ['', [Validators.required, Validators.maxLength(200)]],
    address: [''],
    contactName: ['', [Validators.required, Validators.maxLength(200)]],
    contactEmail: ['', [Validators.required, Validators.email]],
    invoiceLater: [false],
  });

  ngOnInit(): void {
    const id = this.id();
    if (!id) return;
    this.loading.set(true);
    this.api.get(id).subscribe({
      next: (c) => {
        this.client.set(c);
        this.form.setValue({ name: c.name, address: c.addressLines.join('\n'), contactName: c.contactName, contactEmail: c.contactEmail, invoiceLater: c.invoiceLater });
        this.loading.set(false);
      },
      error: (error) => {
        this.error.set(problemMessage(error));
        this.loading.set(false);
      },
    });
  }

  save(): void {
    clearServerErrors(this.form);
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const v = this.form.getRawValue();
    const body = { name: v.name.trim(), addressLines: addressLines(v.address).slice(0, 6), contactName: v.contactName.trim(), contactEmail: v.contactEmail.trim(), invoiceLater: v.invoiceLater };
    const id = this.id();
    this.busy.set(true);
    this.error.set(null);
    (id ? this.api.update(id, body) : this.api.create(body)).subscribe({
      next: () => void this.router.navigate(['/clients']),
      error: (error) => {
        this.error.set(showProblemOnForm(this.form, error, { addressLines: 'address' }));
        this.busy.set(false);
      },
    });
  }

  inviteAdministrator(): void {
    const c = this.client();
    if (!c) return;
    this.busy.set(true);
    this.error.set(null);
    this.api.inviteAdministrator(c.id).subscribe({
      next: (sent) => {
        this.busy.set(false);
        this.notice.set(`Invitation sent to ${sent.email ?? c.contactEmail}. They will see their reports from your lab on their own portal.`);
      },
      error: (error) => {
        this.busy.set(false);
        this.error.set(problemMessage(error));
      },
    });
  }
}
