import { ChangeDetectionStrategy, Component, computed, inject, input, signal, effect } from '@angular/core';
import { RouterLink } from '@angular/router';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RunsApi, type RunDetail } from './runs-api';
import { CasePanel } from './case-panel';
import { problemMessage } from '../session/problem-message';
import { SessionStore } from '../session/session-store';
import { StateBadge } from '../ui/state-badge';
import { RfCaution } from '../ui/rf-caution';
import { RunInstruments } from './run-instruments';

/** The run workspace: every test case of a run, and the commands that move it along. */
@Component({
  selector: 'sc-run-workspace',
  imports: [RouterLink, FormsModule, MatButtonModule, MatIconModule, MatFormFieldModule, MatInputModule, MatProgressBarModule, CasePanel, StateBadge, RfCaution, RunInstruments],
  templateUrl: './run-workspace.html',
  styleUrl: './run-workspace.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RunWorkspace {
  private readonly runs = inject(RunsApi);
  protected readonly session = inject(SessionStore);

  readonly id = input.required<string>();
  protected readonly run = signal<RunDetail | null>(null);
  protected readonly loading = signal(true);
  protected readonly error = signal<string | null>(null);
  protected readonly acting = signal(false);
  protected readonly actionError = signal<string | null>(null);
  protected readonly notice = signal<string | null>(null);
  protected returnReason = '';
  protected readonly returning = signal(false);

  protected readonly editable = computed(() => this.run()?.state === 'testing' && this.session.hasRole('engineer', 'lab-admin'));
  protected readonly complete = computed(() => this.run()?.testCases.every((c) => !!c.result || !!c.traceResult) ?? false);
  protected readonly canEditInstruments = computed(() => this.editable());
  protected readonly canSubmit = computed(() => this.editable());
  protected readonly canReview = computed(() => this.run()?.state === 'in-review' && this.session.hasRole('reviewer', 'lab-admin'));
  protected readonly canIssue = computed(() => this.run()?.state === 'approved' && this.session.hasRole('reviewer', 'lab-admin'));

  constructor() {
    effect(() => this.load(this.id()));
  }

  load(id: string): void {
    this.loading.set(true);
    this.error.set(null);
    this.runs.get(id).subscribe({
      next: (run) => {
        this.run.set(run);
        this.loading.set(false);
      },
      error: (error) => {
        this.error.set(problemMessage(error));
        this.loading.set(false);
      },
    });
  }

  act(action: 'submit' | 'approve' | 'return' | 'issue'): void {
    const run = this.run();
    if (!run) return;
    this.acting.set(true);
    this.actionError.set(null);
    this.runs.act(run.id, action, action === 'return' ? this.returnReason.trim() : undefined).subscribe({
      next: () => {
        this.acting.set(false);
        this.returning.set(false);
        this.notice.set(
          { submit: 'Sent for technical review.', approve: 'Results authorized. The report can now be issued.', return: 'Returned to the bench with your reason.', issue: 'Report issued and signed. The client has been notified by e-mail.' }[action],
        );
        this.load(run.id);
      },
      error: (error) => {
        this.actionError.set(problemMessage(error));
        this.acting.set(false);
      },
    });
  }

  instrumentsChanged(run: RunDetail): void {
    this.run.set(run);
    this.notice.set('Instruments saved. Their calibration and uncertainty join every result saved from now on.');
  }

  caseSaved(): void {
    const run = this.run();
    if (run) this.load(run.id);
  }
}
