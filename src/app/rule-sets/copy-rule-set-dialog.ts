import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';

export interface CopyRuleSetDialogData {
  sourceName: string;
  isSample: boolean;
}

/** Asks for the name of the lab's copy of a rule set; closes with the trimmed name, or undefined. */
@Component({
  selector: 'sc-copy-rule-set-dialog',
  imports: [ReactiveFormsModule, MatDialogModule, MatButtonModule, MatFormFieldModule, MatInputModule],
  template: `
    <h2 mat-dialog-title>Copy to your lab</h2>
    <form [formGroup]="form" (ngSubmit)="confirm()">
      <mat-dialog-content>
        <p class="intro">
          Your copy starts at version 1 and is yours to change.
          @if (data.isSample) {
            <strong>It is no longer a shipped sample: verify every limit against the current edition of its source before testing with it.</strong>
          }
        </p>
        <mat-form-field class="field">
          <mat-label>Name of your rule set</mat-label>
          <input matInput formControlName="name" cdkFocusInitial required maxlength="200" />
          <mat-error>Give your rule set a name.</mat-error>
        </mat-form-field>
      </mat-dialog-content>
      <mat-dialog-actions align="end">
        <button mat-button type="button" mat-dialog-close>Cancel</button>
        <button mat-flat-button type="submit">Make the copy</button>
      </mat-dialog-actions>
    </form>
  `,
  styles: `.intro { margin: 0 0 12px; color: var(--sc-muted); max-width: 460px; } .field { width: 100%; min-width: min(460px, 80vw); }`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CopyRuleSetDialog {
  protected readonly data = inject<CopyRuleSetDialogData>(MAT_DIALOG_DATA);
  private readonly ref = inject<MatDialogRef<CopyRuleSetDialog, string>>(MatDialogRef);
  protected readonly name = new FormControl(`${this.data.sourceName} (our copy)`.slice(0, 200), { nonNullable: true, validators: [Validators.required, Validators.pattern(/\S/)] });
  // A FormGroupDirective on the form is what gives (ngSubmit); without it the browser would submit the page.
  protected readonly form = new FormGroup({ name: this.name });

  confirm(): void {
    if (this.name.invalid) {
      this.name.markAsTouched();
      return;
    }
    this.ref.close(this.name.value.trim());
  }
}
