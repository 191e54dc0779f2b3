import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { Router, RouterLink } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { SessionStore } from '../session/session-store';
import { clearServerErrors, showProblemOnForm } from '../session/show-problem-on-form';
import { AccountFrame } from './account-frame';
import { AccountsApi } from './accounts-api';
import { addressLines } from './address-lines';
import { PASSWORD_RULE_TEXT, passwordStrength } from './password-strength';

/** A new lab signs up: the lab, its address for reports, and its first administrator, signed in at once. */
@Component({
  selector: 'sc-sign-up-page',
  imports: [ReactiveFormsModule, RouterLink, MatButtonModule, MatFormFieldModule, MatInputModule, MatProgressBarModule, AccountFrame],
  templateUrl: './sign-up-page.html',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SignUpPage {
  private readonly api = inject(AccountsApi);
  private readonly session = inject(SessionStore);
  private readonly router = inject(Router);

  protected readonly passwordRule = PASSWORD_RULE_TEXT;
  protected readonly busy = signal(false);
  protected readonly error = signal<string | null>(null);
  protected readonly form = inject(NonNullableFormBuilder).group({
    labName: ['', [Validators.required, Validators.maxLength(200), Validators.pattern(/\S/)]],
    labCode: ['', Validators.pattern(/^[A-Za-z0-9]{2,8}$/)],
    address: ['', [Validators.required, Validators.pattern(/\S/)]],
    name: ['', [Validators.required, Validators.maxLength(200), Validators.pattern(/\S/)]],
    email: ['', [Validators.required, Validators.email]],
    password: ['', [Validators.required, passwordStrength]],
  });

  async signUp(): Promise<void> {
    clearServerErrors(this.form);
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const v = this.form.getRawValue();
    this.busy.set(true);
    this.error.set(null);
    try {
      const { organizationId } = await firstValueFrom(
        this.api.signUp({ labName: v.labName.trim(), labCode: v.labCode.trim() || undefined, address: addressLines(v.address).slice(0, 6), name: v.name.trim(), email: v.email.trim(), password: v.password }),
      );
      // The answer set the refresh cookie; the session store takes the access token from there.
      this.session.switchOrganization(organizationId);
      await this.session.refresh();
      await this.router.navigateByUrl('/');
    } catch (error) {
      this.error.set(showProblemOnForm(this.form, error));
    } finally {
      this.busy.set(false);
    }
  }
}
