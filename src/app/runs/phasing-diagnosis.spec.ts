import { TestBed } from '@angular/core/testing';
import { PhasingDiagnosis } from './phasing-diagnosis';

async function render(measured: number | null, required: number | null) {
  const fixture = TestBed.createComponent(PhasingDiagnosis);
  fixture.componentRef.setInput('measured', measured);
  fixture.componentRef.setInput('required', required);
  await fixture.whenStable();
  return (fixture.nativeElement as HTMLElement).textContent!.replace(/\s+/g, ' ');
}

describe('PhasingDiagnosis', () => {
  it('explains a failing suppression in terms of phase and amplitude error', async () => {
    // Image rejection with g = 1: IRR = cot²(φ/2); 2° alone gives 35.16 dB (published relation,
    // arithmetic: cot²(1°) = 3282.8 → 35.16 dB). So 35.16 dB reads as a 2.00° phase error.
    const text = await render(35.16, 40);
    expect(text).toContain('phase error of 2.00°');
    expect(text).toContain('40 dB is required');
    // For 40 dB with the errors sharing it equally, each alone must give 43.01 dB: about 0.81°
    // and about 0.12 dB (IRR ≈ 4/θ² and 4/ε², common practice small-error form).
    expect(text).toMatch(/within about 0\.12 dB/);
    expect(text).toMatch(/within about 0\.81°/);
  });

  it('says nothing when the suppression meets the requirement, or a figure is missing', async () => {
    expect((await render(45, 40)).trim()).toBe('');
    expect((await render(null, 40)).trim()).toBe('');
    expect((await render(-3, 40)).trim()).toBe('');
  });
});
