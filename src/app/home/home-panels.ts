import { ChangeDetectionStrategy, Component, computed, inject, output, signal } from '@angular/core';
import { DatePipe } from '@angular/common';
import { RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { problemMessage } from '../session/problem-message';
import { SessionStore } from '../session/session-store';
import { StateBadge } from '../ui/state-badge';
import { CalibrationChip } from '../equipment/calibration-chip';
import { RUN_STATES, RUN_STATE_LABELS, type RunState } from '../../../shared/runs/run-state';
import { activityLink, activityText } from './activity-text';
import { HomeApi, type LabHome } from './home-api';

/** Queues of the bench board a state count opens (the runs table's filter values). */
const QUEUE_OF: Partial<Record<RunState, string>> = { draft: 'testing,draft', testing: 'testing,draft', 'in-review': 'in-review', approved: 'approved', issued: 'issued' };

/** The four panels of the lab home (GET /api/home): runs by state, my reviews, calibration due, recent activity. */
@Component({
  selector: 'sc-home-panels',
  imports: [DatePipe, RouterLink, MatButtonModule, MatProgressBarModule, StateBadge, CalibrationChip],
  templateUrl: './home-panels.html',
  styleUrl: './home-panels.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class HomePanels {
  private readonly api = inject(HomeApi);
  private readonly session = inject(SessionStore);

  /** A state count was chosen: show that queue in the runs table. */
  readonly queueChosen = output<string>();

  protected readonly home = signal<LabHome | null>(null);
  protected readonly loading = signal(true);
  protected readonly error = signal<string | null>(null);
  protected readonly states = computed(() => {
    const counts = this.home()?.runsByState;
    return counts ? RUN_STATES.map((state) => ({ state, label: RUN_STATE_LABELS[state], count: counts[state] ?? 0, queue: QUEUE_OF[state] ?? null })) : [];
  });
  protected readonly totalRuns = computed(() => this.states().reduce((n, s) => n + s.count, 0));
  protected readonly myUserId = computed(() => this.session.user()?.userId);
  protected readonly text = activityText;
  protected readonly link = activityLink;

  constructor() {
    this.load();
  }

  load(): void {
    this.loading.set(true);
    this.error.set(null);
    this.api.home().subscribe({
      next: (home) => {
        this.home.set(home);
        this.loading.set(false);
      },
      error: (error) => {
        this.error.set(problemMessage(error));
        this.loading.set(false);
      },
    });
  }
}
