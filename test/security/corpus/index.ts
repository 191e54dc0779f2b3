/**
 * The hostile-input corpus (issue 8): everything is built in memory from small valid files and
 * values, so nothing binary is committed. `countCorpus` says how many inputs there are.
 */
import type { HostileFile } from './hostile-file';
import { fileNameCorpus } from './file-names';
import { iqFileCorpus } from './iq-files';
import { HOSTILE_LIST_QUERIES } from './list-queries';
import { BAD_PATH_IDS } from './path-params';
import { HOSTILE_VALUES, RAW_BODIES, SHAPE_BODIES } from './json-bodies';
import { traceCsvCorpus } from './trace-csv-files';

export type { HostileFile, HostilePart } from './hostile-file';
export { bodyMutations, HOSTILE_VALUES, RAW_BODIES, SHAPE_BODIES, type SchemaNode } from './json-bodies';
export { BAD_PATH_IDS } from './path-params';
export { HOSTILE_LIST_QUERIES } from './list-queries';
export { validTraceCsv, TRACE_CARRIER_HZ } from './trace-csv-files';

/** Every hostile file: traces, SigMF, WAV, raw I/Q, mislabelled files (not the file names). */
export async function hostileFiles(): Promise<HostileFile[]> {
  return [...traceCsvCorpus(), ...(await iqFileCorpus())];
}

export { fileNameCorpus };

/** How many inputs the corpus holds, by kind. */
export async function countCorpus(): Promise<Record<string, number> & { total: number }> {
  const files = await hostileFiles();
  const counts = {
    files: files.length,
    fileNames: fileNameCorpus().length,
    rawBodies: RAW_BODIES.length,
    shapeBodies: SHAPE_BODIES.length,
    fieldValues: HOSTILE_VALUES.length,
    pathIds: BAD_PATH_IDS.length,
    listQueries: HOSTILE_LIST_QUERIES.length,
  };
  return { ...counts, total: Object.values(counts).reduce((a, b) => a + b, 0) };
}
