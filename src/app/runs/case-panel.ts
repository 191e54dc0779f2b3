import { ChangeDetectionStrategy, Component, computed, effect, inject, input, output, signal } from '@angular/core';
import { DecimalPipe } from '@angular/common';
import { FormControl, FormGroup, ReactiveFormsModule } from '@angular/forms';
import { toSignal } from '@angular/core/rxjs-interop';
import { startWith } from 'rxjs';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressSpinnerModule } from '@angular/material/progress-spinner';
import { READING_FIELDS } from '../../../shared/evaluation/reading-fields';
import { evaluateTestCase } from '../../../shared/evaluation/evaluate-test-case';
import type { TestCaseResult } from '../../../shared/evaluation/test-case-result';
import type { RuleSetBody } from '../../../shared/rules/rule-set';
import { TEST_KIND_LABELS } from '../../../shared/rules/test-kind';
import { RunsApi, type RunCase, type StoredResult } from './runs-api';
import { problemMessage } from '../session/problem-message';
import { VerdictChip } from '../ui/verdict-chip';
import { CaseUpload, evidenceFor } from './case-upload';
import { PhasingDiagnosis } from './phasing-diagnosis';

/** One test case of a run: its reading form, the live result computed in the browser, and the server's stored result. */
@Component({
  selector: 'sc-case-panel',
  imports: [DecimalPipe, ReactiveFormsModule, MatButtonModule, MatFormFieldModule, MatInputModule, MatIconModule, MatProgressSpinnerModule, VerdictChip, CaseUpload, PhasingDiagnosis],
  templateUrl: './case-panel.html',
  styleUrl: './case-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CasePanel {
  private readonly runs = inject(RunsApi);

  readonly runId = input.required<string>();
  readonly testCase = input.required<RunCase>();
  readonly rules = input.required<RuleSetBody>();
  readonly editable = input(false);
  readonly saved = output<StoredResult | null>();
  readonly uploaded = output<void>();

  protected readonly kindLabels = TEST_KIND_LABELS;
  protected readonly fields = computed(() => READING_FIELDS[this.testCase().kind]);
  /** Trace and I/Q kinds take a file; those without hand fields take only a file. */
  protected readonly uploadable = computed(() => evidenceFor(this.testCase().kind).length > 0);
  protected readonly maskReference = computed(() => this.rules().limits.emissionMask?.reference ?? 'mean');
  protected readonly latestUploadId = computed(() => this.testCase().uploads?.[0]?.id ?? null);
  protected readonly form = new FormGroup<Record<string, FormControl<number | null>>>({});
  private readonly values = toSignal(this.form.valueChanges.pipe(startWith(this.form.value)), { initialValue: {} });
  protected readonly saving = signal(false);
  protected readonly saveError = signal<string | null>(null);
  protected readonly stored = signal<StoredResult | null>(null);
  protected readonly serverProblem = signal<string | null>(null);

  /** The result as typed: the same shared engine the server runs. */
  protected readonly live = computed<{ result: TestCaseResult | null; message: string | null }>(() => {
    const values = this.values() as Record<string, number | null>;
    const fields = this.fields();
    if (fields.length === 0) return { result: null, message: 'This measurement is evaluated from an imported trace.' };
    if (fields.some((f) => !f.optional && (values[f.key] === null || values[f.key] === undefined || Number.isNaN(values[f.key])))) {
      return { result: null, message: 'Enter the readings to see the result.' };
    }
    try {
      return { result: evaluateTestCase({ kind: this.testCase().kind, readings: values, rules: this.rules() }), message: null };
    } catch (error) {
      return { result: null, message: (error as Error).message };
    }
  });
  protected readonly agrees = computed(() => {
    const s = this.stored();
    const l = this.live().result;
    return !!s && !!l && s.verdict === l.verdict && Math.abs((s.value ?? NaN) - l.value) < 1e-9;
  });

  constructor() {
    // The run is reloaded whenever any case saves; only a different stored reading replaces what is
    // in the form, so values typed meanwhile in this case are never wiped.
    let shownReadingId: string | null | undefined;
    effect(() => {
      const c = this.testCase();
      const readingId = c.reading?.id ?? null;
      for (const f of READING_FIELDS[c.kind]) {
        if (!this.form.contains(f.key)) this.form.addControl(f.key, new FormControl<number | null>(null));
        if (readingId === shownReadingId) continue;
        const v = c.reading?.values[f.key];
        this.form.controls[f.key].setValue(typeof v === 'number' ? v : null, { emitEvent: true });
      }
      shownReadingId = readingId;
      this.stored.set(c.result);
    });
    effect(() => (this.editable() ? this.form.enable({ emitEvent: false }) : this.form.disable({ emitEvent: false })));
  }

  save(): void {
    const values: Record<string, number | null> = {};
    for (const f of this.fields()) {
      const v = this.form.controls[f.key].value;
      values[f.key] = typeof v === 'number' && Number.isFinite(v) ? v : null;
    }
    this.saving.set(true);
    this.saveError.set(null);
    this.runs.saveReading(this.runId(), this.testCase().id, values).subscribe({
      next: (answer) => {
        this.stored.set(answer.result);
        this.serverProblem.set(answer.problem);
        this.saving.set(false);
        this.saved.emit(answer.result);
      },
      error: (error) => {
        this.saveError.set(problemMessage(error));
        this.saving.set(false);
      },
    });
  }
}
