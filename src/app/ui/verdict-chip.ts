import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';

const WORDS: Record<string, string> = {
  pass: 'Pass',
  'conditional-pass': 'Conditional pass',
  'conditional-fail': 'Conditional fail',
  fail: 'Fail',
  'not-evaluated': 'Not evaluated',
};

/** An ILAC-G8 verdict as a word with a matching tint: never colour alone. */
@Component({
  selector: 'sc-verdict-chip',
  template: `<span class="chip" [class]="'chip ' + verdict()">{{ word() }}</span>`,
  styles: `
    .chip { display: inline-block; padding: 3px 10px; border-radius: 12px; font-size: 13px; font-weight: 500; white-space: nowrap; }
    .pass { background: var(--sc-pass-bg); color: var(--sc-pass); }
    .conditional-pass { background: var(--sc-cpass-bg); color: var(--sc-cpass); }
    .conditional-fail { background: var(--sc-cfail-bg); color: var(--sc-cfail); }
    .fail { background: var(--sc-fail-bg); color: var(--sc-fail); }
    .not-evaluated { background: #eceff0; color: var(--sc-muted); }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class VerdictChip {
  readonly verdict = input.required<string>();
  protected readonly word = computed(() => WORDS[this.verdict()] ?? this.verdict());
}
