import { TestBed } from '@angular/core/testing';
import { MaskPlot } from './mask-plot';
import type { MaskSeries } from './mask-plot-series';

// jsdom has no canvas: a stand-in records what the component asks of uPlot (the real drawing is
// checked in the browser suite, test/e2e/lab-admin.test.ts, by the canvas changing).
const made: FakePlot[] = [];
class FakePlot {
  width = 560;
  setDataCalls: unknown[][] = [];
  constructor(
    readonly opts: { series: { label?: string }[]; axes: { label?: string }[] },
    readonly data: unknown[],
    readonly target: HTMLElement,
  ) {
    made.push(this);
  }
  batch(fn: () => void) {
    fn();
  }
  setData(d: unknown[]) {
    this.setDataCalls.push(d);
  }
  setSize() {}
  destroy() {}
}
jest.mock('uplot', () => ({ __esModule: true, default: jest.fn((o, d, t) => new FakePlot(o, d, t)) }));

describe('MaskPlot', () => {
  beforeEach(() => (made.length = 0));

  it('draws the series once, then updates the same chart when the series changes', async () => {
    const fixture = TestBed.createComponent(MaskPlot);
    const first: MaskSeries = { offsetHz: [-3000, 0, 3000], relDb: [-28, 0, -28] };
    fixture.componentRef.setInput('series', first);
    fixture.componentRef.setInput('reference', 'mean power');
    fixture.componentRef.setInput('summary', 'Mask: 0 dB to ±1.5 kHz');
    await fixture.whenStable();
    expect(made).toHaveLength(1);
    expect(made[0].data).toEqual([first.offsetHz, first.relDb]);
    expect(made[0].opts.axes[1].label).toBe('dB relative to mean power');
    expect(fixture.nativeElement.querySelector('[role="img"]').getAttribute('aria-label')).toBe('Mask: 0 dB to ±1.5 kHz');

    const second: MaskSeries = { offsetHz: [-3000, 0, 3000], relDb: [-35, 0, -35] };
    fixture.componentRef.setInput('series', second);
    await fixture.whenStable();
    expect(made).toHaveLength(1);
    expect(made[0].setDataCalls).toEqual([[second.offsetHz, second.relDb]]);
  });
});
