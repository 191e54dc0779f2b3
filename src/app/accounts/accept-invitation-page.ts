import { ChangeDetectionStrategy, Component, OnInit, inject, input, signal } from '@angular/core';
import { DatePipe } from '@angular/common';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { Router, RouterLink } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { SessionStore } from '../session/session-store';
import { problemMessage } from '../session/problem-message';
import { clearServerErrors, showProblemOnForm } from '../session/show-problem-on-form';
import { AccountFrame } from './account-frame';
import { AccountsApi, type InvitationLookup } from './accounts-api';
import { PASSWORD_RULE_TEXT, passwordStrength } from './password-strength';

/**
 * The page an invitation e-mail links to (/invitations/:token): says what the link is for, asks
 * for a name and password only when the address has no account yet, and accepts.
 */
@Component({
  selector: 'sc-accept-invitation-page',
  imports: [DatePipe, ReactiveFormsModule, RouterLink, MatButtonModule, MatFormFieldModule, MatInputModule, MatProgressBarModule, AccountFrame],
  templateUrl: './accept-invitation-page.html',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AcceptInvitationPage implements OnInit {
  private readonly api = inject(AccountsApi);
  private readonly session = inject(SessionStore);
  private readonly router = inject(Router);

  /** From the route (withComponentInputBinding). */
  readonly token = input.required<string>();

  protected readonly passwordRule = PASSWORD_RULE_TEXT;
  protected readonly invitation = signal<InvitationLookup | null>(null);
  protected readonly loading = signal(true);
  protected readonly busy = signal(false);
  protected readonly error = signal<string | null>(null);
  /** Set once an existing account has accepted: it signs in as usual next. */
  protected readonly joined = signal(false);
  protected readonly form = inject(NonNullableFormBuilder).group({
    name: ['', [Validators.required, Validators.maxLength(200), Validators.pattern(/\S/)]],
    password: ['', [Validators.required, passwordStrength]],
  });

  ngOnInit(): void {
    this.api.lookupInvitation(this.token()).subscribe({
      next: (found) => {
        this.invitation.set(found);
        this.loading.set(false);
      },
      error: (error) => {
        this.error.set(problemMessage(error));
        this.loading.set(false);
      },
    });
  }

  async accept(): Promise<void> {
    const found = this.invitation();
    if (!found) return;
    clearServerErrors(this.form);
    if (!found.accountExists && this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.busy.set(true);
    this.error.set(null);
    try {
      const v = this.form.getRawValue();
      const body = found.accountExists ? { token: this.token() } : { token: this.token(), name: v.name.trim(), password: v.password };
      const accepted = await firstValueFrom(this.api.acceptInvitation(body));
      if (!accepted.accountCreated) {
        this.joined.set(true);
        return;
      }
      // A new account is signed in by the answer's cookie; start in the organization that invited.
      this.session.switchOrganization(accepted.organizationId);
      await this.session.refresh();
      await this.router.navigateByUrl(accepted.kind === 'auditor' ? '/auditor' : found.organizationKind === 'lab' ? '/' : '/reports');
    } catch (error) {
      this.error.set(showProblemOnForm(this.form, error));
    } finally {
      this.busy.set(false);
    }
  }
}
