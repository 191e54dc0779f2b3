import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { FormControl, ReactiveFormsModule, Validators } from '@angular/forms';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';

export interface ReasonDialogData {
  title: string;
  /** What will happen, in one or two sentences. */
  intro: string;
  label: string;
  confirm: string;
  /** A destructive action (withdrawal) gets the warning colour. */
  warn?: boolean;
}

/**
 * Asks for the reason an action needs (return to the bench, withdraw, correct). Closes with the
 * trimmed reason, or undefined when cancelled. 3 to 2000 characters, as the server's reason schema.
 */
@Component({
  selector: 'sc-reason-dialog',
  imports: [ReactiveFormsModule, MatDialogModule, MatButtonModule, MatFormFieldModule, MatInputModule],
  template: `
    <h2 mat-dialog-title>{{ data.title }}</h2>
    <form (submit)="$event.preventDefault(); confirm()">
      <mat-dialog-content>
        <p class="intro">{{ data.intro }}</p>
        <mat-form-field class="field">
          <mat-label>{{ data.label }}</mat-label>
          <textarea matInput [formControl]="reason" rows="4" cdkFocusInitial required maxlength="2000"></textarea>
          @if (reason.touched && reason.invalid) {
            <mat-error>Give a reason of at least 3 characters.</mat-error>
          }
        </mat-form-field>
      </mat-dialog-content>
      <mat-dialog-actions align="end">
        <button mat-button type="button" mat-dialog-close>Cancel</button>
        <button mat-flat-button type="submit" [class.warn]="data.warn">{{ data.confirm }}</button>
      </mat-dialog-actions>
    </form>
  `,
  styles: `
    .intro { margin: 0 0 12px; color: var(--sc-muted); }
    .field { width: 100%; min-width: min(460px, 80vw); }
    .warn { --mdc-filled-button-container-color: var(--sc-fail); --mat-button-filled-container-color: var(--sc-fail); }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ReasonDialog {
  protected readonly data = inject<ReasonDialogData>(MAT_DIALOG_DATA);
  private readonly ref = inject<MatDialogRef<ReasonDialog, string>>(MatDialogRef);
  protected readonly reason = new FormControl('', { nonNullable: true, validators: [Validators.required, Validators.minLength(3), Validators.maxLength(2000), Validators.pattern(/\S/)] });

  confirm(): void {
    const text = this.reason.value.trim();
    if (text.length < 3) {
      this.reason.markAsTouched();
      this.reason.setErrors({ minlength: true });
      return;
    }
    this.ref.close(text);
  }
}
