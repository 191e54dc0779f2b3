import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { DecimalPipe } from '@angular/common';
import { diagnosePhasing, type PhasingDiagnosis as Diagnosis } from '../../../shared/phasing/diagnose-phasing';

let nextId = 0;

/**
 * For an unwanted-sideband suppression that does not pass: the phasing-modulator errors that would
 * explain it and what the design must hold, in plain words (shared/phasing diagnosePhasing, from
 * the published image-rejection relation). Shows nothing when the figures cannot be diagnosed.
 */
@Component({
  selector: 'sc-phasing-diagnosis',
  imports: [DecimalPipe],
  template: `
    @if (diagnosis(); as d) {
      <aside class="phasing" role="note" [attr.aria-labelledby]="titleId">
        <h3 [id]="titleId">Why the suppression falls short: phasing diagnosis</h3>
        <p>
          The unwanted sideband is {{ measured() | number: '1.2-2' }} dB down; {{ required() | number: '1.0-1' }} dB is required.
          In a phasing-method exciter that is what either of these alone would give:
        </p>
        <ul>
          <li>a <strong>phase error of {{ d.phaseErrorAloneDeg | number: '1.2-2' }}°</strong> between the I and Q paths, with their amplitudes perfectly matched, or</li>
          <li>an <strong>amplitude imbalance of {{ d.amplitudeImbalanceAloneDb | number: '1.2-3' }} dB</strong> between them, with the phasing exactly 90°.</li>
        </ul>
        <p>Smaller errors of both kinds together give the same result.</p>
        <p class="need">
          To reach {{ required() | number: '1.0-1' }} dB, hold the I/Q amplitude match within about
          <strong>{{ d.tolerancePair.amplitudeImbalanceDb | number: '1.2-2' }} dB</strong> and the phase within about
          <strong>{{ d.tolerancePair.phaseErrorDeg | number: '1.2-2' }}°</strong> across the whole audio band
          (together they give {{ d.tolerancePairRejectionDb | number: '1.1-1' }} dB). Ripple of the Hilbert filter counts as amplitude error.
        </p>
      </aside>
    }
  `,
  styles: `
    .phasing { background: #f3f7fb; border: 1px solid #c9d9e8; border-left: 4px solid #2f7fb5; border-radius: 8px; padding: 12px 16px; font-size: 14px; }
    h3 { margin: 0 0 6px; font: 500 15px/1.3 Roboto, sans-serif; }
    p { margin: 6px 0; }
    ul { margin: 4px 0; padding-left: 20px; }
    .need { margin-top: 8px; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PhasingDiagnosis {
  /** Measured unwanted-sideband suppression, dB. */
  readonly measured = input.required<number | null>();
  /** Required suppression (the rule set's limit), dB. */
  readonly required = input.required<number | null>();
  /** Unique per instance: a page can show several diagnoses. */
  protected readonly titleId = `phasing-title-${nextId++}`;

  protected readonly diagnosis = computed<Diagnosis | null>(() => {
    const measured = this.measured();
    const required = this.required();
    if (measured === null || required === null) return null;
    try {
      const d = diagnosePhasing({ measuredSuppressionDb: measured, requiredDb: required });
      return d.meetsRequirement ? null : d;
    } catch {
      // Out of the relation's domain (a negative reading): nothing useful to say.
      return null;
    }
  });
}
