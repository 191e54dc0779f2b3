import { ChangeDetectionStrategy, Component, inject, input, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators, type AbstractControl, type ValidationErrors } from '@angular/forms';
import { RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { problemMessage } from '../session/problem-message';
import { AccountFrame } from './account-frame';
import { AccountsApi } from './accounts-api';
import { PASSWORD_RULE_TEXT, passwordStrength } from './password-strength';

function sameAsPassword(control: AbstractControl): ValidationErrors | null {
  const password = control.parent?.get('password')?.value as string | undefined;
  return control.value === password ? null : { mismatch: true };
}

/** Choose a new password from a reset link (/password-reset/:token); every session then ends. */
@Component({
  selector: 'sc-password-reset-complete-page',
  imports: [ReactiveFormsModule, RouterLink, MatButtonModule, MatFormFieldModule, MatInputModule, MatProgressBarModule, AccountFrame],
  template: `
    <sc-account-frame>
      <form [formGroup]="form" (ngSubmit)="save()" aria-labelledby="new-password-title">
        @if (busy()) {
          <mat-progress-bar mode="indeterminate" aria-label="Saving the new password" />
        }
        <h1 id="new-password-title">Choose a new password</h1>
        @if (error(); as message) {
          <div class="sc-error-banner" role="alert">{{ message }}</div>
        }
        @if (done()) {
          <p class="done" role="status">Your password has been changed and every session of your account has been signed out. Sign in with the new password.</p>
          <a mat-flat-button routerLink="/sign-in">Sign in</a>
        } @else {
          <mat-form-field>
            <mat-label>New password</mat-label>
            <input matInput type="password" formControlName="password" autocomplete="new-password" required (input)="form.controls.repeat.updateValueAndValidity()" />
            <mat-hint>{{ passwordRule }}</mat-hint>
            <mat-error>{{ form.controls.password.getError('password') || 'Choose a password.' }}</mat-error>
          </mat-form-field>
          <mat-form-field>
            <mat-label>Repeat the new password</mat-label>
            <input matInput type="password" formControlName="repeat" autocomplete="new-password" required />
            <mat-error>The two passwords differ.</mat-error>
          </mat-form-field>
          <button mat-flat-button type="submit" [disabled]="busy()">Set the new password</button>
          <p class="links"><a routerLink="/password-reset">Ask for a new link</a><a routerLink="/sign-in">Back to sign in</a></p>
        }
      </form>
    </sc-account-frame>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PasswordResetCompletePage {
  private readonly api = inject(AccountsApi);

  readonly token = input.required<string>();

  protected readonly passwordRule = PASSWORD_RULE_TEXT;
  protected readonly busy = signal(false);
  protected readonly error = signal<string | null>(null);
  protected readonly done = signal(false);
  protected readonly form = inject(NonNullableFormBuilder).group({
    password: ['', [Validators.required, passwordStrength]],
    repeat: ['', [Validators.required, sameAsPassword]],
  });

  save(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.busy.set(true);
    this.error.set(null);
    this.api.completePasswordReset(this.token(), this.form.getRawValue().password).subscribe({
      next: () => {
        this.done.set(true);
        this.busy.set(false);
      },
      error: (error) => {
        this.error.set(problemMessage(error));
        this.busy.set(false);
      },
    });
  }
}
