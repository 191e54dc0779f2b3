import { ImportError } from '../../shared/import/import-error';
import type { TraceEvidence } from '../../shared/evaluation/evaluate-trace';
import { runHeavy } from '../workers/heavy-pool';
import type { ImportErrorData } from '../workers/heavy-work';
import { importFailure } from './import-failure';
import type { TracePlacement, TraceSummary } from './summarise-trace';

export type { TraceSummary } from './summarise-trace';

/**
 * Reads a spectrum-analyzer trace CSV and returns the evidence the evaluation needs plus the
 * summary kept with the upload (summariseTrace, in a worker thread of lower priority: a trace of
 * thousands of rows is milliseconds of CPU). The CSV is parsed whole, which is why its size has
 * its own, smaller limit.
 *
 * @throws ImportProblem (422) naming the line and column of the first bad field.
 */
export async function analyseTraceFile(filePath: string, placement: TracePlacement): Promise<{ evidence: TraceEvidence; summary: TraceSummary }> {
  const outcome = await runHeavy<{ trace: { evidence: TraceEvidence; summary: TraceSummary } } | { importError: ImportErrorData }>({ kind: 'read-trace', filePath, placement });
  if ('importError' in outcome) {
    const { message, ...location } = outcome.importError;
    // The same error as thrown in the worker: its message already carries the importer and location.
    importFailure(Object.assign(new ImportError('', '', location), { message }), 'file');
  }
  return outcome.trace;
}
