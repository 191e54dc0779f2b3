import { ChangeDetectionStrategy, Component, DestroyRef, ElementRef, ViewEncapsulation, afterNextRender, afterRenderEffect, inject, input, viewChild } from '@angular/core';
import uPlot from 'uplot';
import type { MaskSeries } from './mask-plot-series';

/**
 * An emission mask's limit line drawn with uPlot: offset from the assigned frequency (kHz)
 * against the limit in dB relative to the mask's reference, both sides. Redraws whenever
 * `series` changes (setData on the same chart, so typing in the vertex table moves the line at
 * once). The vertex table beside it is the text alternative; `summary` names the plot for
 * assistive technology.
 */
@Component({
  selector: 'sc-mask-plot',
  template: `<div #plot class="sc-mask-plot" role="img" [attr.aria-label]="summary()"></div>`,
  styleUrls: ['../../../node_modules/uplot/dist/uPlot.min.css'],
  styles: `
    sc-mask-plot { display: block; min-width: 0; }
    .sc-mask-plot .u-legend { font-size: 12px; color: var(--sc-ink); }
  `,
  encapsulation: ViewEncapsulation.None,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MaskPlot {
  private readonly host = inject(ElementRef<HTMLElement>);
  private readonly plotEl = viewChild.required<ElementRef<HTMLDivElement>>('plot');

  readonly series = input.required<MaskSeries>();
  /** What the dB are relative to: 'PEP' or 'mean power'. */
  readonly reference = input('PEP');
  readonly summary = input('Emission mask limit line');
  readonly height = input(260);

  private chart: uPlot | null = null;

  constructor() {
    const destroyRef = inject(DestroyRef);
    afterNextRender(() => {
      const observer = typeof ResizeObserver === 'undefined' ? null : new ResizeObserver(() => this.fit());
      observer?.observe(this.host.nativeElement);
      destroyRef.onDestroy(() => observer?.disconnect());
    });
    afterRenderEffect(() => this.draw(this.series()));
    destroyRef.onDestroy(() => this.chart?.destroy());
  }

  private width(): number {
    return Math.max(280, Math.floor(this.host.nativeElement.clientWidth || 560));
  }

  private fit(): void {
    if (this.chart && Math.abs(this.chart.width - this.width()) > 1) this.chart.setSize({ width: this.width(), height: this.height() });
  }

  private draw(series: MaskSeries): void {
    const data = [series.offsetHz, series.relDb] as uPlot.AlignedData;
    if (!this.chart) {
      this.chart = new uPlot(this.options(), data, this.plotEl().nativeElement);
      return;
    }
    const chart = this.chart;
    chart.batch(() => chart.setData(data));
  }

  private options(): uPlot.Options {
    const kHz = (_u: uPlot, splits: number[]) => splits.map((v) => (v / 1e3).toLocaleString('en-GB', { maximumFractionDigits: 2 }));
    return {
      width: this.width(),
      height: this.height(),
      cursor: { drag: { x: false, y: false } },
      scales: { x: { time: false }, y: { auto: true, range: (_u, min, max) => [Math.min(min, -10) - 5, Math.max(max, 0) + 5] } },
      axes: [
        { label: 'Offset from the assigned frequency (kHz)', values: kHz, stroke: '#5a6d70', grid: { stroke: '#e3eaeb' } },
        { label: `dB relative to ${this.reference()}`, stroke: '#5a6d70', grid: { stroke: '#e3eaeb' }, size: 56 },
      ],
      series: [
        { label: 'Offset', value: (_u, v) => (v === null ? '—' : `${(v / 1e3).toFixed(3)} kHz`) },
        {
          label: 'Limit',
          stroke: '#b3261e',
          width: 2,
          // Tint the forbidden region above the line.
          fill: 'rgba(179, 38, 30, 0.08)',
          fillTo: (u) => u.scales['y'].max ?? 0,
          value: (_u, v) => (v === null ? '—' : `${v.toFixed(1)} dB`),
          points: { show: true, size: 6, stroke: '#b3261e', fill: '#ffffff' },
        },
      ],
    };
  }
}
