import { TestBed } from '@angular/core/testing';
import { SpectrumChart, pannedRange, zoomedRange } from './spectrum-chart';

// jsdom has no canvas, so uPlot itself cannot draw here: a stand-in records what the component asks
// of it (the real drawing is exercised in the browser suite and the client benchmark).
const made: FakePlot[] = [];
class FakePlot {
  scales: Record<string, { min?: number; max?: number }> = { x: {} };
  width = 640;
  root = document.createElement('div');
  over = document.createElement('div');
  series: { points?: { filter?: () => number[] | null } }[];
  setDataCalls: unknown[][] = [];
  constructor(
    readonly opts: { series: { points?: { filter?: () => number[] | null } }[] },
    readonly data: unknown[],
    readonly target: HTMLElement,
  ) {
    this.series = opts.series;
    const x = data[0] as number[];
    this.scales['x'] = { min: x[0], max: x[x.length - 1] };
    made.push(this);
  }
  batch(fn: () => void) {
    fn();
  }
  setData(d: unknown[]) {
    this.setDataCalls.push(d);
  }
  setScale(_key: string, r: { min: number; max: number }) {
    this.scales['x'] = { ...r };
  }
  setSize() {}
  destroy() {}
}
jest.mock('uplot', () => ({ __esModule: true, default: jest.fn((o, d, t) => new FakePlot(o, d, t)) }));

describe('zoomedRange and pannedRange (pure)', () => {
  const full = { min: 0, max: 100 };
  it.each([
    // [range, factor, centre, expected]: arithmetic of a symmetric zoom about the centre.
    [{ min: 0, max: 100 }, 0.5, 50, { min: 25, max: 75 }],
    [{ min: 25, max: 75 }, 2, 50, { min: 0, max: 100 }],
    // Zooming about a point keeps that point where it was on screen (here 1/4 from the left).
    [{ min: 0, max: 100 }, 0.5, 25, { min: 12.5, max: 62.5 }],
    // Zooming out past the full span stops at the full span.
    [{ min: 40, max: 60 }, 100, 50, { min: 0, max: 100 }],
  ])('zooms %o by %d about %d', (range, factor, centre, expected) => {
    expect(zoomedRange(range, full, factor, centre)).toEqual(expected);
  });

  it('pans by a fraction of the visible width and stops at the ends without shrinking', () => {
    expect(pannedRange({ min: 10, max: 20 }, full, 0.5)).toEqual({ min: 15, max: 25 });
    expect(pannedRange({ min: 90, max: 100 }, full, 1)).toEqual({ min: 90, max: 100 });
    expect(pannedRange({ min: 0, max: 10 }, full, -3)).toEqual({ min: 0, max: 10 });
  });
});

describe('SpectrumChart', () => {
  beforeEach(() => (made.length = 0));

  async function render(points = 1000, worst: number | null = 400) {
    const fixture = TestBed.createComponent(SpectrumChart);
    const x = Float64Array.from({ length: points }, (_, i) => 2_180_000 + i * 10);
    const y = Float64Array.from({ length: points }, (_, i) => -60 + (i === worst ? 20 : 0));
    const limit = Array.from({ length: points }, (_, i) => (i < 100 ? null : -45));
    fixture.componentRef.setInput('frequencyHz', x);
    fixture.componentRef.setInput('levelDb', y);
    fixture.componentRef.setInput('limitDb', limit);
    fixture.componentRef.setInput('worstIndex', worst);
    fixture.componentRef.setInput('label', 'Emission mask trace');
    await fixture.whenStable();
    return { fixture, x, y, limit };
  }

  it('hands the trace and the limit line to uPlot aligned on one frequency axis, and rings the worst point', async () => {
    const { x, y, limit } = await render();
    expect(made).toHaveLength(1);
    expect(made[0].data[0]).toBe(x);
    expect(made[0].data[1]).toBe(y);
    expect(made[0].data[2]).toBe(limit);
    expect(made[0].series[1].points!.filter!()).toEqual([400]);
  });

  it('redraws with setData (no new chart) when the trace changes, and reports the draw time', async () => {
    const { fixture } = await render();
    const next = Float64Array.from({ length: 100_000 }, (_, i) => i);
    fixture.componentRef.setInput('frequencyHz', next);
    fixture.componentRef.setInput('levelDb', new Float64Array(100_000));
    fixture.componentRef.setInput('limitDb', null);
    fixture.componentRef.setInput('worstIndex', null);
    await fixture.whenStable();
    expect(made).toHaveLength(1);
    const [d] = made[0].setDataCalls.slice(-1);
    expect(d[0]).toBe(next);
    // No limit: a series of gaps, so nothing is drawn for the mask.
    expect((d[2] as unknown[]).every((v) => v === null)).toBe(true);
    expect(made[0].series[1].points!.filter!()).toBeNull();
    expect(fixture.componentInstance.drawMs()).toEqual(expect.any(Number));
  });

  it('zooms, pans and resets from the toolbar and the keyboard', async () => {
    const { fixture } = await render(1001);
    const el: HTMLElement = fixture.nativeElement;
    const full = { min: 2_180_000, max: 2_190_000 };
    (el.querySelector('button[aria-label="Zoom in"]') as HTMLButtonElement).click();
    expect(made[0].scales['x']).toEqual({ min: 2_182_500, max: 2_187_500 });
    (el.querySelector('button[aria-label="Pan towards higher frequencies"]') as HTMLButtonElement).click();
    expect(made[0].scales['x']).toEqual({ min: 2_183_750, max: 2_188_750 });
    const plot = el.querySelector('[role="group"]') as HTMLElement;
    plot.dispatchEvent(new KeyboardEvent('keydown', { key: '0' }));
    expect(made[0].scales['x']).toEqual(full);
    plot.dispatchEvent(new KeyboardEvent('keydown', { key: '+' }));
    expect(made[0].scales['x']).toEqual({ min: 2_182_500, max: 2_187_500 });
    expect(plot.getAttribute('aria-label')).toBe('Emission mask trace');
  });
});
