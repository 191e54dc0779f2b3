import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { RUN_STATE_LABELS, type RunState } from '../../../shared/runs/run-state';

@Component({
  selector: 'sc-state-badge',
  template: `<span class="badge" [attr.data-state]="state()">{{ label() }}</span>`,
  styles: `
    .badge { display: inline-flex; align-items: center; gap: 6px; font-size: 13px; white-space: nowrap; }
    .badge::before { content: ''; width: 8px; height: 8px; border-radius: 2px; background: #8fa3a5; transform: rotate(45deg); }
    [data-state='testing']::before { background: #2f7fb5; }
    [data-state='in-review']::before { background: #c98a00; }
    [data-state='approved']::before { background: #5e7d18; }
    [data-state='issued']::before { background: #1f7a4d; }
    [data-state='withdrawn']::before, [data-state='superseded']::before { background: #b3261e; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class StateBadge {
  readonly state = input.required<RunState>();
  protected readonly label = computed(() => RUN_STATE_LABELS[this.state()] ?? this.state());
}
