import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { problemMessage } from '../session/problem-message';
import { clearServerErrors, showProblemOnForm } from '../session/show-problem-on-form';
import { addressLines } from '../accounts/address-lines';
import { SessionStore } from '../session/session-store';
import { LabDetailsApi } from './lab-details-api';

/**
 * The lab's name, address, contact and accreditation as printed on every report it issues from now
 * on, and its e-mail choice: whether the report-issued e-mail carries the signed PDF.
 */
@Component({
  selector: 'sc-lab-details-page',
  imports: [ReactiveFormsModule, MatButtonModule, MatCheckboxModule, MatFormFieldModule, MatInputModule, MatProgressBarModule],
  templateUrl: './lab-details-page.html',
  styleUrl: './settings-section.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LabDetailsPage {
  private readonly api = inject(LabDetailsApi);
  private readonly session = inject(SessionStore);

  protected readonly loading = signal(true);
  /** Saving is offered only over details actually read, never over an empty form. */
  protected readonly loaded = signal(false);
  protected readonly busy = signal(false);
  protected readonly error = signal<string | null>(null);
  protected readonly notice = signal<string | null>(null);
  protected readonly code = signal('');
  protected readonly form = inject(NonNullableFormBuilder).group({
    name: ['', [Validators.required, Validators.maxLength(200), Validators.pattern(/\S/)]],
    address: ['', [Validators.required, Validators.pattern(/\S/)]],
    email: ['', Validators.email],
    phone: ['', Validators.maxLength(50)],
    accreditation: ['', Validators.maxLength(200)],
  });

  /** PUT and GET /organization/mail-settings admit lab administrators only (server/organizations/routes.ts). */
  protected readonly canChangeMail = computed(() => this.session.hasRole('lab-admin'));
  protected readonly mailLoading = signal(false);
  protected readonly mailLoaded = signal(false);
  protected readonly mailBusy = signal(false);
  protected readonly mailError = signal<string | null>(null);
  protected readonly mailNotice = signal<string | null>(null);
  protected readonly mailForm = inject(NonNullableFormBuilder).group({ attachPdfToEmail: [false] });

  constructor() {
    this.load();
    this.mailForm.disable();
    if (this.canChangeMail()) this.loadMail();
  }

  loadMail(): void {
    this.mailLoading.set(true);
    this.mailError.set(null);
    this.api.mailSettings().subscribe({
      next: (settings) => {
        this.mailForm.setValue({ attachPdfToEmail: settings.attachPdfToEmail });
        this.mailForm.enable();
        this.mailLoading.set(false);
        this.mailLoaded.set(true);
      },
      error: (error) => {
        this.mailError.set(problemMessage(error));
        this.mailLoading.set(false);
      },
    });
  }

  saveMail(): void {
    if (!this.mailLoaded() || !this.canChangeMail()) return;
    const { attachPdfToEmail } = this.mailForm.getRawValue();
    this.mailBusy.set(true);
    this.mailError.set(null);
    this.mailNotice.set(null);
    this.api.saveMailSettings({ attachPdfToEmail }).subscribe({
      next: (saved) => {
        this.mailBusy.set(false);
        this.mailForm.setValue({ attachPdfToEmail: saved.attachPdfToEmail });
        this.mailNotice.set(
          saved.attachPdfToEmail
            ? 'Saved. Report e-mails sent from now on carry the signed PDF.'
            : 'Saved. Report e-mails sent from now on ask the client to sign in and download the signed PDF.',
        );
      },
      error: (error) => {
        this.mailBusy.set(false);
        this.mailError.set(problemMessage(error));
      },
    });
  }

  load(): void {
    this.loading.set(true);
    this.error.set(null);
    this.api.get().subscribe({
      next: (lab) => {
        this.code.set(lab.code);
        this.form.setValue({ name: lab.name, address: lab.addressLines.join('\n'), email: lab.email ?? '', phone: lab.phone ?? '', accreditation: lab.accreditation ?? '' });
        this.loading.set(false);
        this.loaded.set(true);
        this.form.enable();
      },
      error: (error) => {
        this.error.set(problemMessage(error));
        this.loading.set(false);
        if (!this.loaded()) this.form.disable();
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
    this.busy.set(true);
    this.error.set(null);
    this.notice.set(null);
    this.api.save({ name: v.name.trim(), addressLines: addressLines(v.address).slice(0, 6), email: v.email.trim() || null, phone: v.phone.trim() || null, accreditation: v.accreditation.trim() || null }).subscribe({
      next: () => {
        this.busy.set(false);
        this.notice.set('Saved. Reports issued from now on carry these details; reports already issued keep theirs.');
      },
      error: (error) => {
        this.busy.set(false);
        this.error.set(showProblemOnForm(this.form, error, { addressLines: 'address' }));
      },
    });
  }
}
