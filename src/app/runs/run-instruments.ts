import { ChangeDetectionStrategy, Component, computed, inject, input, output, signal } from '@angular/core';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { InstrumentRegisterApi } from './instrument-register-api';
import { RunsApi, type RunDetail, type RunInstrument } from './runs-api';
import { problemMessage } from '../session/problem-message';

const STATUS_WORDS: Record<RunInstrument['calibrationStatus'], string> = { valid: 'In calibration', 'due-soon': 'Calibration due soon', overdue: 'Calibration overdue' };

/**
 * The instruments on the bench for a run. Choosing one past its calibration is not blocked here:
 * the server refuses it (ISO/IEC 17025:2017 6.4, from memory) and its message is shown as it is.
 */
@Component({
  selector: 'sc-run-instruments',
  imports: [FormsModule, MatButtonModule, MatCheckboxModule, MatFormFieldModule, MatIconModule, MatInputModule, MatProgressBarModule],
  templateUrl: './run-instruments.html',
  styleUrl: './run-instruments.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RunInstruments {
  private readonly register = inject(InstrumentRegisterApi);
  private readonly runs = inject(RunsApi);

  readonly runId = input.required<string>();
  readonly assigned = input.required<RunInstrument[]>();
  readonly editable = input(false);
  readonly changed = output<RunDetail>();

  protected readonly statusWords = STATUS_WORDS;
  protected readonly editing = signal(false);
  protected readonly loading = signal(false);
  protected readonly saving = signal(false);
  protected readonly error = signal<string | null>(null);
  protected readonly available = signal<RunInstrument[]>([]);
  protected readonly chosen = signal<ReadonlySet<string>>(new Set());
  protected search = '';
  protected readonly chosenCount = computed(() => this.chosen().size);

  edit(): void {
    this.chosen.set(new Set(this.assigned().map((i) => i.id)));
    this.editing.set(true);
    this.error.set(null);
    this.find();
  }

  find(): void {
    this.loading.set(true);
    this.register.list(this.search).subscribe({
      next: (page) => {
        this.available.set(page.items);
        this.loading.set(false);
      },
      error: (e) => {
        this.error.set(problemMessage(e));
        this.loading.set(false);
      },
    });
  }

  toggle(id: string, on: boolean): void {
    const next = new Set(this.chosen());
    if (on) next.add(id);
    else next.delete(id);
    this.chosen.set(next);
  }

  save(): void {
    this.saving.set(true);
    this.error.set(null);
    this.runs.setInstruments(this.runId(), [...this.chosen()]).subscribe({
      next: (run) => {
        this.saving.set(false);
        this.editing.set(false);
        this.changed.emit(run);
      },
      error: (e) => {
        // The server names each overdue instrument and its due date: show that, unchanged.
        this.error.set(problemMessage(e));
        this.saving.set(false);
      },
    });
  }
}
