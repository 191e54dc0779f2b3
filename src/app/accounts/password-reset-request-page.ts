import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { problemMessage } from '../session/problem-message';
import { AccountFrame } from './account-frame';
import { AccountsApi } from './accounts-api';

/** Ask for a password reset link. The answer never says whether the address has an account. */
@Component({
  selector: 'sc-password-reset-request-page',
  imports: [ReactiveFormsModule, RouterLink, MatButtonModule, MatFormFieldModule, MatInputModule, MatProgressBarModule, AccountFrame],
  template: `
    <sc-account-frame>
      <form [formGroup]="form" (ngSubmit)="send()" aria-labelledby="reset-title">
        @if (busy()) {
          <mat-progress-bar mode="indeterminate" aria-label="Sending" />
        }
        <h1 id="reset-title">Reset your password</h1>
        @if (error(); as message) {
          <div class="sc-error-banner" role="alert">{{ message }}</div>
        }
        @if (sent(); as detail) {
          <p class="done" role="status">{{ detail }}</p>
        } @else {
          <p>Enter the e-mail address you sign in with. We will send you a link to choose a new password.</p>
          <mat-form-field>
            <mat-label>E-mail</mat-label>
            <input matInput type="email" formControlName="email" autocomplete="username" required />
            <mat-error>Enter an e-mail address such as name&#64;lab.example.</mat-error>
          </mat-form-field>
          <button mat-flat-button type="submit" [disabled]="busy()">Send the link</button>
        }
        <p class="links"><a routerLink="/sign-in">Back to sign in</a></p>
      </form>
    </sc-account-frame>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PasswordResetRequestPage {
  private readonly api = inject(AccountsApi);

  protected readonly busy = signal(false);
  protected readonly error = signal<string | null>(null);
  protected readonly sent = signal<string | null>(null);
  protected readonly form = inject(NonNullableFormBuilder).group({ email: ['', [Validators.required, Validators.email]] });

  send(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.busy.set(true);
    this.error.set(null);
    this.api.requestPasswordReset(this.form.getRawValue().email.trim()).subscribe({
      next: (answer) => {
        this.sent.set(answer.detail);
        this.busy.set(false);
      },
      error: (error) => {
        this.error.set(problemMessage(error));
        this.busy.set(false);
      },
    });
  }
}
