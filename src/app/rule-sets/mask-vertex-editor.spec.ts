import { TestBed } from '@angular/core/testing';
import { FormArray } from '@angular/forms';
import { MaskVertexEditor } from './mask-vertex-editor';
import { vertexGroup, type VertexGroup } from './vertex-form';

// jsdom has no canvas: uPlot is replaced by a recorder (the real drawing is checked in
// test/e2e/lab-admin.test.ts by the canvas changing).
const drawn: unknown[][] = [];
jest.mock('uplot', () => ({
  __esModule: true,
  default: jest.fn((_o: unknown, d: unknown[]) => {
    drawn.push(d);
    return { width: 560, batch: (fn: () => void) => fn(), setData: (x: unknown[]) => drawn.push(x), setSize() {}, destroy() {} };
  }),
}));

// 47 CFR 80.211(a), authorized bandwidth 3.0 kHz (offsets from memory): the first two regions.
const rows = () => new FormArray<VertexGroup>([vertexGroup([1500, 0]), vertexGroup([1500, -28]), vertexGroup([4500, -28]), vertexGroup([4500, -35])]);

describe('MaskVertexEditor', () => {
  beforeEach(() => (drawn.length = 0));

  it('redraws as a limit is typed and keeps the last valid mask while a row is wrong', async () => {
    const fixture = TestBed.createComponent(MaskVertexEditor);
    const array = rows();
    fixture.componentRef.setInput('rows', array);
    await fixture.whenStable();
    const first = drawn.at(-1) as number[][];
    expect(first[1]).toContain(-28);

    const input: HTMLInputElement = fixture.nativeElement.querySelector('[aria-label="Limit of vertex 2, dB"]');
    input.value = '-25';
    input.dispatchEvent(new Event('input'));
    await fixture.whenStable();
    const second = drawn.at(-1) as number[][];
    expect(second[1]).toContain(-25);
    expect(second[1]).not.toContain(-28.5);

    const offset: HTMLInputElement = fixture.nativeElement.querySelector('[aria-label="Offset of vertex 4, Hz"]');
    offset.value = '4000';
    offset.dispatchEvent(new Event('input'));
    await fixture.whenStable();
    expect(fixture.nativeElement.textContent).toContain('Must not be below the previous offset (4500 Hz).');
    expect(offset.getAttribute('aria-invalid')).toBe('true');
    expect(drawn.at(-1)).toEqual(second);
  });

  it('sorts rows by offset, keeping the order inside a step', async () => {
    const fixture = TestBed.createComponent(MaskVertexEditor);
    const array = new FormArray<VertexGroup>([vertexGroup([4500, -35]), vertexGroup([1500, 0]), vertexGroup([1500, -28])]);
    fixture.componentRef.setInput('rows', array);
    await fixture.whenStable();
    (fixture.componentInstance as MaskVertexEditor).sortByOffset();
    expect(array.getRawValue()).toEqual([
      { offsetHz: '1500', relDb: '0' },
      { offsetHz: '1500', relDb: '-28' },
      { offsetHz: '4500', relDb: '-35' },
    ]);
  });
});
