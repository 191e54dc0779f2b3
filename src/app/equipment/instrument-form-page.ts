import { ChangeDetectionStrategy, Component, OnInit, computed, inject, input, signal } from '@angular/core';
import { DecimalPipe } from '@angular/common';
import { FormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { Router, RouterLink } from '@angular/router';
import { takeUntilDestroyed, toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { problemMessage } from '../session/problem-message';
import { clearServerErrors, showProblemOnForm } from '../session/show-problem-on-form';
import { CalibrationChip } from './calibration-chip';
import { calibratedNotAfterToday, dueAfterCalibration, todayUtc } from './calibration-dates';
import { BUDGETS, BUDGET_WORDS, DISTRIBUTION_WORDS, contributionBody, contributionGroup, contributionStandard } from './contribution-form';
import { EquipmentApi, type Instrument } from './equipment-api';
import type { UncertaintyDistribution } from '../../../shared/uncertainty/uncertainty-contribution';

/** Add an instrument (/equipment/new) or change one (/equipment/:id/edit), with its uncertainty contributions. */
@Component({
  selector: 'sc-instrument-form-page',
  imports: [DecimalPipe, ReactiveFormsModule, RouterLink, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatProgressBarModule, MatSelectModule, CalibrationChip],
  templateUrl: './instrument-form-page.html',
  styleUrl: './instrument-form-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class InstrumentFormPage implements OnInit {
  private readonly api = inject(EquipmentApi);
  private readonly router = inject(Router);
  private readonly fb = inject(FormBuilder);

  readonly id = input<string>();

  protected readonly budgets = BUDGETS;
  protected readonly budgetWords = BUDGET_WORDS;
  protected readonly distributions = Object.keys(DISTRIBUTION_WORDS) as UncertaintyDistribution[];
  protected readonly distributionWords = DISTRIBUTION_WORDS;
  protected readonly editing = computed(() => !!this.id());
  protected readonly instrument = signal<Instrument | null>(null);
  protected readonly loading = signal(false);
  protected readonly busy = signal(false);
  protected readonly error = signal<string | null>(null);
  /** The UTC date, as the server judges "not after today" (server/instruments/instrument-checks.ts). */
  protected readonly today = todayUtc();
  protected readonly form = this.fb.nonNullable.group({
    name: ['', [Validators.required, Validators.maxLength(200)]],
    model: ['', [Validators.required, Validators.maxLength(200)]],
    serialNumber: ['', [Validators.required, Validators.maxLength(100)]],
    calibratedOn: ['', [Validators.required, calibratedNotAfterToday()]],
    calibrationDue: ['', [Validators.required, dueAfterCalibration()]],
    certificateRef: ['', [Validators.required, Validators.maxLength(200)]],
    contributions: this.fb.array([contributionGroup(this.fb)]),
  });
  private readonly values = toSignal(this.form.valueChanges, { initialValue: this.form.getRawValue() });
  /** |c|·u of each row, recomputed as the person types. */
  protected readonly standards = computed(() => {
    this.values();
    return this.form.controls.contributions.controls.map((g) => contributionStandard(g.getRawValue()));
  });

  constructor() {
    // The due date is judged against the calibration date: judge it again when that changes.
    this.form.controls.calibratedOn.valueChanges.pipe(takeUntilDestroyed()).subscribe(() => this.form.controls.calibrationDue.updateValueAndValidity());
  }

  /** The message under the calibration date: the server's, else the first rule it breaks. */
  protected calibratedOnMessage(): string {
    const control = this.form.controls.calibratedOn;
    const afterToday = control.getError('afterToday') as { today: string } | null;
    return control.getError('server') ?? (afterToday ? `The calibration cannot be after today (${afterToday.today}, UTC).` : 'Enter the calibration date.');
  }

  /** The message under the due date: the server's, else the first rule it breaks. */
  protected calibrationDueMessage(): string {
    const control = this.form.controls.calibrationDue;
    const early = control.getError('dueNotAfterCalibration') as { calibratedOn: string } | null;
    return control.getError('server') ?? (early ? `The calibration must fall due after the day it was done (${early.calibratedOn}).` : 'Enter the due date.');
  }

  ngOnInit(): void {
    const id = this.id();
    if (!id) return;
    this.loading.set(true);
    this.api.get(id).subscribe({
      next: (i) => {
        this.instrument.set(i);
        const rows = this.form.controls.contributions;
        rows.clear();
        for (const c of i.contributions) rows.push(contributionGroup(this.fb, c));
        this.form.patchValue({ name: i.name, model: i.model, serialNumber: i.serialNumber, calibratedOn: i.calibratedOn, calibrationDue: i.calibrationDue, certificateRef: i.certificateRef });
        this.loading.set(false);
      },
      error: (error) => {
        this.error.set(problemMessage(error));
        this.loading.set(false);
      },
    });
  }

  addContribution(): void {
    this.form.controls.contributions.push(contributionGroup(this.fb));
  }

  removeContribution(index: number): void {
    this.form.controls.contributions.removeAt(index);
  }

  save(): void {
    clearServerErrors(this.form);
    const v = this.form.getRawValue();
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const body = {
      name: v.name.trim(),
      model: v.model.trim(),
      serialNumber: v.serialNumber.trim(),
      calibratedOn: v.calibratedOn,
      calibrationDue: v.calibrationDue,
      certificateRef: v.certificateRef.trim(),
      contributions: this.form.controls.contributions.controls.map((g) => contributionBody(g.getRawValue())),
    };
    const id = this.id();
    this.busy.set(true);
    this.error.set(null);
    (id ? this.api.update(id, body) : this.api.create(body)).subscribe({
      next: () => void this.router.navigate(['/equipment']),
      error: (error) => {
        this.error.set(showProblemOnForm(this.form, error));
        this.busy.set(false);
      },
    });
  }
}
