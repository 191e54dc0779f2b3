import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { DecimalPipe, PercentPipe } from '@angular/common';
import { READING_FIELDS } from '../../../shared/evaluation/reading-fields';
import { TEST_KIND_LABELS } from '../../../shared/rules/test-kind';
import type { RunCase } from '../runs/runs-api';
import { VerdictChip } from '../ui/verdict-chip';
import { CaseComments } from './case-comments';
import { CaseFiles } from './case-files';

/** Human words for the keys the engine stores as inputs (shared/evaluation), unit included. */
const INPUT_WORDS: Record<string, string> = {
  referenceDbm: 'Reference level (dBm)',
  assignedHz: 'Assigned frequency (Hz)',
  worstFrequencyHz: 'Worst point (Hz)',
  worstOffsetHz: 'Worst point offset (Hz)',
  worstMarginDb: 'Worst margin (dB)',
  occupiedBandwidthHz: 'Occupied bandwidth (Hz)',
  occupiedLowerHz: 'Lower 0.5 % point (Hz)',
  occupiedUpperHz: 'Upper 0.5 % point (Hz)',
  rbwHz: 'RBW (Hz)',
  carrierSuppressionDb: 'Carrier suppression (dB)',
  unwantedSidebandSuppressionDb: 'Unwanted-sideband suppression (dB)',
  imd3BelowPepDb: 'IMD3 below PEP (dB)',
  imd5BelowPepDb: 'IMD5 below PEP (dB)',
  decidingOrder: 'Deciding IMD order',
};

/**
 * One test case as the reviewer checks it: the stored result with what it was computed from (the
 * reading as entered, the engine's inputs), the uncertainty budget row by row, the evidence files
 * and the case's comment thread.
 */
@Component({
  selector: 'sc-case-review',
  imports: [DecimalPipe, PercentPipe, VerdictChip, CaseComments, CaseFiles],
  templateUrl: './case-review.html',
  styleUrl: './case-review.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CaseReview {
  readonly runId = input.required<string>();
  readonly testCase = input.required<RunCase>();
  readonly canComment = input(true);

  protected readonly kindLabels = TEST_KIND_LABELS;
  /** The result on record: the latest of the reading's and the upload's (each is stored append-only). */
  protected readonly shown = computed(() => {
    const { result, traceResult } = this.testCase();
    if (result && traceResult) return result.createdAt > traceResult.createdAt ? result : traceResult;
    return result ?? traceResult ?? null;
  });
  protected readonly source = computed(() => (this.shown() === this.testCase().result ? 'reading, saved last' : 'uploaded file, judged last'));
  protected readonly unit = computed(() => (this.shown()?.unit === 'Hz' ? 'Hz' : 'dB'));
  /** The reading as entered, in the form's own words and units. */
  protected readonly entered = computed(() => {
    const values = this.testCase().reading?.values ?? {};
    const fields = READING_FIELDS[this.testCase().kind];
    return Object.entries(values)
      .filter(([key]) => key !== 'note')
      .map(([key, value]) => {
        const f = fields.find((x) => x.key === key);
        return { label: f ? `${f.label} (${f.unit})` : key, value: value === null || value === undefined ? '—' : String(value) };
      });
  });
  protected readonly note = computed(() => {
    const n = this.testCase().reading?.values['note'];
    return typeof n === 'string' && n.trim() ? n : null;
  });
  /** The engine's inputs (from an upload or derived figures), numbers and short texts only. */
  protected readonly engineInputs = computed(() => {
    // Figures already shown as the reading are not repeated.
    const entered = new Set(READING_FIELDS[this.testCase().kind].map((f) => f.key));
    return Object.entries(this.shown()?.detail.inputs ?? {})
      .filter(([key, v]) => !entered.has(key) && (v === null || ['number', 'string'].includes(typeof v)))
      .map(([key, value]) => ({ label: INPUT_WORDS[key] ?? key, value: value === null ? '—' : typeof value === 'number' ? formatNumber(value) : String(value) }));
  });
  protected readonly budget = computed(() => this.shown()?.detail.budget ?? []);
  protected readonly instruments = computed(() => this.shown()?.detail.instruments ?? []);
}

function formatNumber(v: number): string {
  return Number.isInteger(v) ? v.toLocaleString('en-GB') : v.toLocaleString('en-GB', { maximumFractionDigits: 4 });
}
