import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { DatePipe, DecimalPipe } from '@angular/common';
import { SpectrumChart } from '../ui/spectrum-chart';
import { VerdictChip } from '../ui/verdict-chip';
import { PhasingDiagnosis } from './phasing-diagnosis';
import { uploadChartData } from './upload-chart-data';
import type { UploadDetail } from './uploads-api';

/**
 * The stored analysis of one upload: the result the server judged (value, limit, margin,
 * uncertainty), the worst point of a mask check in words, the capture's figures, the spectrum
 * chart with the mask, and — for an unwanted-sideband suppression that fails — the phasing diagnosis.
 */
@Component({
  selector: 'sc-upload-analysis-view',
  imports: [DatePipe, DecimalPipe, SpectrumChart, VerdictChip, PhasingDiagnosis],
  templateUrl: './upload-analysis-view.html',
  styleUrl: './upload-analysis-view.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class UploadAnalysisView {
  readonly upload = input.required<UploadDetail>();
  /** Test kind of the case, to decide whether the phasing diagnosis applies. */
  readonly kind = input.required<string>();

  protected readonly result = computed(() => this.upload().result);
  protected readonly mask = computed(() => this.result()?.detail.mask ?? null);
  protected readonly chart = computed(() => {
    const mask = this.mask();
    return uploadChartData(this.upload().analysis, mask, mask ? (this.result()?.value ?? null) : null);
  });
  protected readonly iq = computed(() => {
    const a = this.upload().analysis;
    return a.source === 'iq' ? a : null;
  });
  protected readonly trace = computed(() => {
    const a = this.upload().analysis;
    return a.source === 'trace' ? a : null;
  });
  protected readonly unit = computed(() => (this.result()?.unit === 'Hz' ? 'Hz' : 'dB'));
  protected readonly chartLabel = computed(() =>
    this.iq() ? `Power spectral density of ${this.upload().file.name}` : `Spectrum trace of ${this.upload().file.name}${this.mask() ? ' with the emission mask' : ''}`,
  );
}
