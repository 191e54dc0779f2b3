import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MAX_PACK_CREDITS } from '../../../shared/schemas/billing';
import { LabBillingApi, type Adjustment, type ClientBalance } from './billing-api';
import { problemMessage } from '../session/problem-message';

/**
 * Adds or takes away credits of one client by hand, with the reason (a goodwill credit, a
 * correction, a starting balance): POST /api/billing/adjustments. Closes with the stored
 * adjustment and the new balance, or undefined when cancelled.
 */
@Component({
  selector: 'sc-adjustment-dialog',
  imports: [ReactiveFormsModule, MatDialogModule, MatButtonModule, MatFormFieldModule, MatInputModule],
  template: `
    <h2 mat-dialog-title>Adjust credits: {{ client.name }}</h2>
    <form [formGroup]="form" (ngSubmit)="save()" novalidate>
      <mat-dialog-content>
        <p class="intro">The balance is now {{ client.balance }} {{ client.balance === 1 ? 'credit' : 'credits' }}. The adjustment is kept in the client’s statement with your name and reason.</p>
        <mat-form-field class="field" hideRequiredMarker>
          <mat-label>Credits to add</mat-label>
          <input matInput formControlName="credits" inputmode="numeric" cdkFocusInitial />
          <mat-hint>A negative number takes credits away</mat-hint>
          @if (form.controls.credits.invalid && form.controls.credits.touched) {
            <mat-error>A whole number from −1000 to 1000, not 0</mat-error>
          }
        </mat-form-field>
        <mat-form-field class="field" hideRequiredMarker>
          <mat-label>Reason</mat-label>
          <textarea matInput formControlName="reason" rows="3" maxlength="500"></textarea>
          @if (form.controls.reason.invalid && form.controls.reason.touched) {
            <mat-error>Say why, for the statement</mat-error>
          }
        </mat-form-field>
        @if (after() !== null) {
          <p class="after" role="status">Balance after: {{ after() }}</p>
        }
        @if (error(); as message) {
          <p class="sc-error-banner" role="alert">{{ message }}</p>
        }
      </mat-dialog-content>
      <mat-dialog-actions align="end">
        <button mat-button type="button" mat-dialog-close>Cancel</button>
        <button mat-flat-button type="submit" [disabled]="saving()">Save adjustment</button>
      </mat-dialog-actions>
    </form>
  `,
  styles: `
    .intro { margin: 0 0 12px; color: var(--sc-muted); max-width: 460px; }
    .field { width: 100%; min-width: min(420px, 80vw); display: block; }
    /* Form fields here size their hint line to its content, so the next field needs room below it. */
    .field + .field { margin-top: 18px; }
    .after { margin: 10px 0 0; font-weight: 500; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AdjustmentDialog {
  protected readonly client = inject<ClientBalance>(MAT_DIALOG_DATA);
  private readonly ref = inject<MatDialogRef<AdjustmentDialog, Adjustment>>(MatDialogRef);
  private readonly api = inject(LabBillingApi);

  protected readonly form = new FormGroup({
    credits: new FormControl('', { nonNullable: true, validators: [Validators.required, Validators.pattern(/^\s*[-−]?\s*[1-9]\d{0,3}\s*$/), (c) => (Math.abs(parseCredits(c.value) ?? 0) > MAX_PACK_CREDITS ? { range: true } : null)] }),
    reason: new FormControl('', { nonNullable: true, validators: [Validators.required, Validators.maxLength(500), Validators.pattern(/\S/)] }),
  });
  private readonly credits = toSignal(this.form.controls.credits.valueChanges, { initialValue: '' });
  protected readonly after = computed(() => {
    const n = parseCredits(this.credits());
    return n === null || Math.abs(n) > MAX_PACK_CREDITS ? null : this.client.balance + n;
  });
  protected readonly saving = signal(false);
  protected readonly error = signal<string | null>(null);

  save(): void {
    this.form.markAllAsTouched();
    const credits = parseCredits(this.form.controls.credits.value);
    if (this.form.invalid || credits === null) return;
    this.saving.set(true);
    this.error.set(null);
    this.api.adjust({ clientId: this.client.clientId, credits, reason: this.form.controls.reason.value.trim() }).subscribe({
      next: (adjustment) => this.ref.close(adjustment),
      error: (e) => {
        this.error.set(problemMessage(e));
        this.saving.set(false);
      },
    });
  }
}

/** "5", "-2", "− 3" (typographic minus) as an integer; null for anything else or 0. */
export function parseCredits(text: string): number | null {
  const match = /^\s*([-−]?)\s*([1-9]\d{0,3})\s*$/.exec(text);
  return match ? (match[1] ? -1 : 1) * Number(match[2]) : null;
}
