import type { Result, TestRun } from '../db/models';

export function presentRun(r: TestRun) {
  return {
    id: r.id,
    number: r.number,
    state: r.state,
    planId: r.planId,
    engineerId: r.engineerId,
    reviewerId: r.reviewerId,
    returnReason: r.returnReason,
    testedFrom: r.testedFrom,
    testedTo: r.testedTo,
    createdAt: r.createdAt.toISOString(),
    updatedAt: r.updatedAt.toISOString(),
  };
}

/** What a reading's result presentation reads: a model instance, or the row just written (save-reading.ts). */
export type ReadingResultFacts = Pick<Result, 'id' | 'readingId' | 'engineVersion' | 'value' | 'unit' | 'limitValue' | 'margin' | 'expandedUncertainty' | 'coverageFactor' | 'verdict' | 'detail' | 'createdAt'>;

export function presentResult(r: ReadingResultFacts) {
  return {
    id: r.id,
    readingId: r.readingId,
    engineVersion: r.engineVersion,
    value: r.value,
    unit: r.unit,
    limit: r.limitValue,
    margin: r.margin,
    expandedUncertainty: r.expandedUncertainty,
    coverageFactor: r.coverageFactor,
    verdict: r.verdict,
    detail: r.detail,
    createdAt: r.createdAt.toISOString(),
  };
}
