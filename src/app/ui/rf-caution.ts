import { ChangeDetectionStrategy, Component } from '@angular/core';

/** The usual RF-safety caution shown wherever someone is about to key a transmitter. */
@Component({
  selector: 'sc-rf-caution',
  template: `
    <p class="sc-caution" role="note">
      <span class="material-symbols-outlined" aria-hidden="true">warning</span>
      <span>
        <strong>RF safety.</strong> A transmitter under test delivers hazardous RF power: keep it into a rated dummy load or attenuator,
        never touch the output, load or feeder while keyed, and let loads cool. PA stages carry high voltage. Follow your local
        regulations, RF-exposure limits and licensed practice; Sidecheck does not replace them.
      </span>
    </p>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RfCaution {}
