import {
  ChangeDetectionStrategy,
  Component,
  DestroyRef,
  ElementRef,
  ViewEncapsulation,
  afterNextRender,
  afterRenderEffect,
  inject,
  input,
  signal,
  viewChild,
} from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import uPlot from 'uplot';

/** A closed frequency interval, Hz. */
export interface FrequencyRange {
  min: number;
  max: number;
}

/**
 * The range after zooming by `factor` (< 1 zooms in) about `centre`, kept inside `full`.
 * A range narrower than `minWidth` is not produced: zooming stops there. Pure; never throws.
 * @example zoomedRange({ min: 0, max: 100 }, { min: 0, max: 100 }, 0.5, 50) // { min: 25, max: 75 }
 */
export function zoomedRange(range: FrequencyRange, full: FrequencyRange, factor: number, centre = (range.min + range.max) / 2, minWidth = 1e-6): FrequencyRange {
  const width = Math.min(full.max - full.min, Math.max(minWidth, (range.max - range.min) * factor));
  const left = (centre - range.min) / (range.max - range.min || 1);
  return clampedRange({ min: centre - left * width, max: centre - left * width + width }, full);
}

/**
 * The range shifted by `fraction` of its width (positive = towards higher frequencies), kept
 * inside `full` without changing its width. Pure; never throws.
 * @example pannedRange({ min: 0, max: 10 }, { min: 0, max: 100 }, 0.5) // { min: 5, max: 15 }
 */
export function pannedRange(range: FrequencyRange, full: FrequencyRange, fraction: number): FrequencyRange {
  const shift = (range.max - range.min) * fraction;
  return clampedRange({ min: range.min + shift, max: range.max + shift }, full);
}

function clampedRange(r: FrequencyRange, full: FrequencyRange): FrequencyRange {
  const width = Math.min(r.max - r.min, full.max - full.min);
  const min = Math.min(Math.max(r.min, full.min), full.max - width);
  return { min, max: min + width };
}

/**
 * A spectrum trace or PSD drawn with uPlot: the level against frequency (labelled as an offset
 * from `originHz` in kHz), an optional limit line (the emission mask as an absolute level at each
 * trace point, null where no limit applies) with the forbidden region tinted, and the worst point
 * ringed. Drag to zoom, Shift + drag to pan, double-click to reset; the toolbar and the arrow,
 * + / − and 0 keys do the same without a mouse. uPlot's line paths decimate per pixel column, so a
 * 100 000-point trace redraws in a few milliseconds; `drawMs` holds the time of the last draw.
 */
@Component({
  selector: 'sc-spectrum-chart',
  imports: [MatButtonModule, MatIconModule],
  template: `
    <div class="sc-spectrum-toolbar" role="toolbar" [attr.aria-label]="'Zoom and pan the chart: ' + label()">
      <button mat-icon-button type="button" aria-label="Zoom in" (click)="zoom(0.5)"><mat-icon>zoom_in</mat-icon></button>
      <button mat-icon-button type="button" aria-label="Zoom out" (click)="zoom(2)"><mat-icon>zoom_out</mat-icon></button>
      <button mat-icon-button type="button" aria-label="Pan towards lower frequencies" (click)="pan(-0.25)"><mat-icon>chevron_left</mat-icon></button>
      <button mat-icon-button type="button" aria-label="Pan towards higher frequencies" (click)="pan(0.25)"><mat-icon>chevron_right</mat-icon></button>
      <button mat-icon-button type="button" aria-label="Show the whole span" (click)="reset()"><mat-icon>fit_screen</mat-icon></button>
      <span class="sc-spectrum-hint">Drag to zoom · Shift + drag to pan · double-click to reset</span>
    </div>
    <div #plot class="sc-spectrum-plot" role="group" tabindex="0" [attr.aria-label]="label()" [attr.data-draw-ms]="drawMs()" (keydown)="key($event)"></div>
  `,
  styleUrls: ['../../../node_modules/uplot/dist/uPlot.min.css'],
  styles: `
    sc-spectrum-chart { display: block; min-width: 0; }
    .sc-spectrum-toolbar { display: flex; align-items: center; gap: 2px; flex-wrap: wrap; }
    .sc-spectrum-hint { font-size: 12px; color: var(--sc-muted); margin-left: 8px; }
    .sc-spectrum-plot { outline: none; border-radius: 6px; }
    .sc-spectrum-plot:focus-visible { box-shadow: 0 0 0 2px var(--sc-accent); }
    .sc-spectrum-plot .u-legend { font-size: 12px; color: var(--sc-ink); }
    .sc-spectrum-plot .u-select { background: rgba(13, 92, 99, 0.12); }
  `,
  encapsulation: ViewEncapsulation.None,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SpectrumChart {
  private readonly host = inject(ElementRef<HTMLElement>);
  private readonly plotEl = viewChild.required<ElementRef<HTMLDivElement>>('plot');

  readonly frequencyHz = input.required<ArrayLike<number>>();
  readonly levelDb = input.required<ArrayLike<number | null>>();
  /** Limit at each trace point in the same unit as levelDb; null where the mask sets none. */
  readonly limitDb = input<ArrayLike<number | null> | null>(null);
  /** Index into the trace of the point to ring (the worst margin). */
  readonly worstIndex = input<number | null>(null);
  readonly levelUnit = input('dBm');
  readonly originHz = input(0);
  /** Axis title; by default "Frequency (kHz)", or the offset from originHz when one is set. */
  readonly frequencyLabel = input<string | null>(null);
  readonly label = input.required<string>();
  readonly height = input(320);

  /** Milliseconds the last setData + draw took (performance.now around a synchronous uPlot batch). */
  readonly drawMs = signal<number | null>(null);
  private chart: uPlot | null = null;
  private full: FrequencyRange = { min: 0, max: 1 };
  private worst: number | null = null;

  constructor() {
    const destroyRef = inject(DestroyRef);
    afterNextRender(() => {
      const observer = typeof ResizeObserver === 'undefined' ? null : new ResizeObserver(() => this.fit());
      observer?.observe(this.host.nativeElement);
      destroyRef.onDestroy(() => observer?.disconnect());
    });
    // After render: the plot element exists, and uPlot measures it.
    afterRenderEffect(() => this.draw(this.frequencyHz(), this.levelDb(), this.limitDb(), this.worstIndex()));
    destroyRef.onDestroy(() => this.chart?.destroy());
  }

  zoom(factor: number): void {
    this.setRange(zoomedRange(this.range(), this.full, factor));
  }

  pan(fraction: number): void {
    this.setRange(pannedRange(this.range(), this.full, fraction));
  }

  reset(): void {
    this.setRange(this.full);
  }

  protected key(event: KeyboardEvent): void {
    const actions: Record<string, () => void> = { ArrowLeft: () => this.pan(-0.1), ArrowRight: () => this.pan(0.1), '+': () => this.zoom(0.5), '=': () => this.zoom(0.5), '-': () => this.zoom(2), '0': () => this.reset() };
    const act = actions[event.key];
    if (!act) return;
    event.preventDefault();
    act();
  }

  private range(): FrequencyRange {
    const x = this.chart?.scales['x'];
    return x?.min !== undefined && x.max !== undefined ? { min: x.min, max: x.max } : this.full;
  }

  private setRange(r: FrequencyRange): void {
    this.chart?.setScale('x', r);
  }

  private width(): number {
    return Math.max(280, Math.floor(this.host.nativeElement.clientWidth || 640));
  }

  private fit(): void {
    if (this.chart && Math.abs(this.chart.width - this.width()) > 1) this.chart.setSize({ width: this.width(), height: this.height() });
  }

  private draw(x: ArrayLike<number>, y: ArrayLike<number | null>, limit: ArrayLike<number | null> | null, worst: number | null): void {
    this.full = x.length > 1 ? { min: x[0], max: x[x.length - 1] } : { min: 0, max: 1 };
    const data = [x, y, limit ?? new Array<null>(x.length).fill(null)] as unknown as uPlot.AlignedData;
    this.worst = worst !== null && worst >= 0 && worst < x.length ? worst : null;
    const started = performance.now();
    if (!this.chart) {
      this.chart = new uPlot(this.options(), data, this.plotEl().nativeElement);
      this.bindPan(this.chart);
    } else {
      const chart = this.chart;
      chart.batch(() => chart.setData(data));
    }
    this.drawMs.set(Math.round((performance.now() - started) * 100) / 100);
  }

  private options(): uPlot.Options {
    const origin = () => this.originHz();
    const kHz = (_u: uPlot, splits: number[]) => splits.map((v) => ((v - origin()) / 1e3).toLocaleString('en-GB', { maximumFractionDigits: 3 }));
    return {
      width: this.width(),
      height: this.height(),
      cursor: { drag: { x: true, y: false, setScale: true } },
      scales: { x: { time: false }, y: { auto: true } },
      axes: [
        { label: this.frequencyLabel() ?? (origin() === 0 ? 'Frequency (kHz)' : 'Offset from the centre (kHz)'), values: kHz, stroke: '#5a6d70', grid: { stroke: '#e3eaeb' } },
        { label: this.levelUnit(), stroke: '#5a6d70', grid: { stroke: '#e3eaeb' }, size: 56 },
      ],
      series: [
        { label: 'Offset', value: (_u, v) => (v === null ? '—' : `${((v - origin()) / 1e3).toFixed(3)} kHz`) },
        {
          label: 'Measured',
          stroke: '#0d5c63',
          width: 1,
          value: (_u, v) => (v === null ? '—' : `${v.toFixed(2)} ${this.levelUnit()}`),
          points: { show: false, size: 11, width: 2.5, stroke: '#b3261e', fill: '#f4d35e', filter: () => (this.worst === null ? null : [this.worst]) },
        },
        {
          label: 'Limit',
          stroke: '#b3261e',
          width: 1.5,
          dash: [6, 4],
          spanGaps: false,
          // Tint the region above the limit: anything drawn there is over the mask.
          fill: 'rgba(179, 38, 30, 0.07)',
          fillTo: (u) => u.scales['y'].max ?? 0,
          value: (_u, v) => (v === null ? 'none' : `${v.toFixed(2)} ${this.levelUnit()}`),
          points: { show: false },
        },
      ],
    };
  }

  /** Shift + drag pans: intercept before uPlot's own selection handler sees the mousedown. */
  private bindPan(u: uPlot): void {
    u.root.addEventListener(
      'mousedown',
      (down: MouseEvent) => {
        if (!down.shiftKey || down.button !== 0) return;
        down.stopPropagation();
        down.preventDefault();
        const start = this.range();
        const hzPerPx = (start.max - start.min) / u.over.clientWidth;
        const move = (e: MouseEvent) => u.setScale('x', clampedRange({ min: start.min - (e.clientX - down.clientX) * hzPerPx, max: start.max - (e.clientX - down.clientX) * hzPerPx }, this.full));
        const up = () => {
          document.removeEventListener('mousemove', move);
          document.removeEventListener('mouseup', up);
        };
        document.addEventListener('mousemove', move);
        document.addEventListener('mouseup', up);
      },
      { capture: true },
    );
  }
}
