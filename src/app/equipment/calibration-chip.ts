import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { CalibrationStatus } from '../../../shared/schemas/instruments';

/** Our words for each calibration status; the 30-day window is the server's (server/instruments/calibration-status.ts). */
export const CALIBRATION_WORDS: Record<CalibrationStatus, string> = {
  valid: 'Valid',
  'due-soon': 'Due within 30 days',
  overdue: 'Overdue',
};

/** A calibration status as a word with a matching tint and icon shape: never colour alone. */
@Component({
  selector: 'sc-calibration-chip',
  template: `<span class="chip" [attr.data-status]="status()"><span class="mark" aria-hidden="true"></span>{{ word() }}</span>`,
  styles: `
    .chip { display: inline-flex; align-items: center; gap: 6px; padding: 3px 10px; border-radius: 12px; font-size: 13px; font-weight: 500; white-space: nowrap; }
    .mark { width: 8px; height: 8px; border-radius: 50%; background: currentColor; }
    [data-status='valid'] { background: var(--sc-pass-bg); color: var(--sc-pass); }
    [data-status='due-soon'] { background: var(--sc-cfail-bg); color: var(--sc-cfail); }
    [data-status='due-soon'] .mark { border-radius: 1px; transform: rotate(45deg); }
    [data-status='overdue'] { background: var(--sc-fail-bg); color: var(--sc-fail); }
    [data-status='overdue'] .mark { border-radius: 0; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CalibrationChip {
  readonly status = input.required<CalibrationStatus>();
  protected readonly word = computed(() => CALIBRATION_WORDS[this.status()] ?? this.status());
}
