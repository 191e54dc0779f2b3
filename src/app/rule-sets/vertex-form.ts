import { FormControl, FormGroup } from '@angular/forms';
import { parseVertexNumber, type VertexRow } from './mask-vertices';

/** One vertex row of the editor: both fields as typed text, parsed with parseVertexNumber. */
export type VertexGroup = FormGroup<{ offsetHz: FormControl<string>; relDb: FormControl<string> }>;

/** A row for a stored vertex, or a blank one. */
export function vertexGroup(vertex?: readonly [number, number]): VertexGroup {
  return new FormGroup({
    offsetHz: new FormControl(vertex ? String(vertex[0]) : '', { nonNullable: true }),
    relDb: new FormControl(vertex ? String(vertex[1]) : '', { nonNullable: true }),
  });
}

/** The rows' values as numbers (null where blank or not a number). */
export function vertexRows(groups: readonly VertexGroup[]): VertexRow[] {
  return groups.map((g) => ({ offsetHz: parseVertexNumber(g.controls.offsetHz.value), relDb: parseVertexNumber(g.controls.relDb.value) }));
}
