import { ChangeDetectionStrategy, Component, computed, effect, input, linkedSignal, signal } from '@angular/core';
import { FormArray, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MaskPlot } from './mask-plot';
import { maskPlotSeries, type MaskSeries } from './mask-plot-series';
import { maskSummary } from './mask-summary';
import { maskVertices, vertexProblems, vertexSortOrder, type VertexProblem } from './mask-vertices';
import { vertexGroup, vertexRows, type VertexGroup } from './vertex-form';

/**
 * The table of an emission mask's vertices beside its plot. The plot follows every keystroke;
 * while a row has a problem, the plot keeps the last valid mask and the row says what is wrong.
 * The parent owns the FormArray and reads it with maskVertices(vertexRows(...)) when saving.
 */
@Component({
  selector: 'sc-mask-vertex-editor',
  imports: [ReactiveFormsModule, MatButtonModule, MatIconModule, MaskPlot],
  templateUrl: './mask-vertex-editor.html',
  styleUrl: './mask-vertex-editor.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MaskVertexEditor {
  readonly rows = input.required<FormArray<VertexGroup>>();
  readonly reference = input<'pep' | 'mean'>('pep');
  readonly readOnly = input(false);

  /** Bumped on every change of the rows, so the computeds below re-read the form. */
  private readonly version = signal(0);
  protected readonly referenceWords = computed(() => (this.reference() === 'mean' ? 'mean power' : 'PEP'));
  protected readonly parsed = computed(() => {
    this.version();
    return vertexRows(this.rows().controls);
  });
  protected readonly problems = computed(() => vertexProblems(this.parsed()));
  /** The rows as stored, or the last valid ones while a row has a problem. */
  protected readonly vertices = linkedSignal<ReturnType<typeof vertexRows>, [number, number][]>({
    source: this.parsed,
    computation: (rows, previous) => maskVertices(rows) ?? previous?.value ?? [],
  });
  protected readonly series = computed<MaskSeries>(() => maskPlotSeries(this.vertices()));
  protected readonly summary = computed(() => maskSummary(this.vertices(), this.referenceWords()));

  constructor() {
    effect((onCleanup) => {
      const sub = this.rows().valueChanges.subscribe(() => this.version.update((v) => v + 1));
      this.version.update((v) => v + 1);
      onCleanup(() => sub.unsubscribe());
    });
  }

  protected problemOf(row: number, field: VertexProblem['field']): string | null {
    return this.problems().find((p) => p.row === row && p.field === field)?.message ?? null;
  }

  protected listProblem(): string | null {
    return this.problems().find((p) => p.field === 'list')?.message ?? null;
  }

  addVertex(): void {
    const last = this.parsed().at(-1);
    this.rows().push(vertexGroup(last && last.offsetHz !== null && last.relDb !== null ? [last.offsetHz + 1000, last.relDb] : undefined));
  }

  removeVertex(index: number): void {
    this.rows().removeAt(index);
  }

  /** Put the rows in offset order (rows at one offset keep their order: it says which side of a step is which). */
  sortByOffset(): void {
    const groups = this.rows().controls;
    const sorted = vertexSortOrder(this.parsed()).map((i) => groups[i]);
    this.rows().clear({ emitEvent: false });
    for (const g of sorted) this.rows().push(g, { emitEvent: false });
    this.rows().updateValueAndValidity();
  }
}
