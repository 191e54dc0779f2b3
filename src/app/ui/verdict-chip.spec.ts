import { TestBed } from '@angular/core/testing';
import { VerdictChip } from './verdict-chip';

describe('VerdictChip', () => {
  it.each([
    ['pass', 'Pass'],
    ['conditional-pass', 'Conditional pass'],
    ['conditional-fail', 'Conditional fail'],
    ['fail', 'Fail'],
  ])('shows the ILAC-G8 word for %s, not only a colour', async (verdict, word) => {
    const fixture = TestBed.createComponent(VerdictChip);
    fixture.componentRef.setInput('verdict', verdict);
    await fixture.whenStable();
    const el: HTMLElement = fixture.nativeElement.querySelector('span');
    expect(el.textContent).toBe(word);
    expect(el.classList).toContain(verdict);
  });
});
