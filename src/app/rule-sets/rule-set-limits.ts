import type { RuleSetBody } from '../../../shared/rules/rule-set';

type Limits = RuleSetBody['limits'];

/** A single number of a rule set's limits that the editor shows as one field. */
export interface ScalarLimit {
  /** Stable id, the field's JSON pointer under limits: `${limit}/${field}` (no dot: Angular form keys cannot hold one). */
  id: string;
  limit: keyof Limits;
  field: string;
  label: string;
  unit: string;
  min: number;
  max: number;
}

const scalar = (limit: keyof Limits, field: string, label: string, unit: string, min: number, max: number): ScalarLimit => ({ id: `${limit}/${field}`, limit, field, label, unit, min, max });

/** The numbers the editor offers, with the schema's bounds (shared/schemas/rule-set.ts). */
export const SCALAR_LIMITS: readonly ScalarLimit[] = [
  scalar('carrierSuppression', 'minDbBelowPep', 'Carrier suppression, at least', 'dB below PEP', 0, 200),
  scalar('unwantedSideband', 'minDb', 'Unwanted sideband suppression, at least', 'dB', 0, 200),
  scalar('intermodulation', 'minDbBelowPep', 'Two-tone IMD, at least', 'dB below PEP', 0, 200),
  scalar('spurious', 'baseDb', 'Spurious emissions, 43 + 10 log10(P/W): the base', 'dB', 0, 200),
  scalar('occupiedBandwidth', 'maxHz', 'Occupied bandwidth, at most', 'Hz', 1, 1e9),
  scalar('frequencyTolerance', 'toleranceHz', 'Frequency tolerance, at most', 'Hz', 0, 1e9),
  scalar('audioResponse', 'lowHz', 'Audio passband, low edge', 'Hz', 0, 1e6),
  scalar('audioResponse', 'highHz', 'Audio passband, high edge', 'Hz', 0, 1e6),
  scalar('audioResponse', 'maxVariationDb', 'Audio passband, total variation at most', 'dB', 0, 100),
];

/** The limits the body has, with their numbers and sources, in SCALAR_LIMITS order. Never throws. */
export function presentScalarLimits(body: RuleSetBody): { def: ScalarLimit; value: number; source: string }[] {
  return SCALAR_LIMITS.flatMap((def) => {
    const limit = body.limits[def.limit] as (Record<string, unknown> & { source: string }) | undefined;
    const value = limit?.[def.field];
    return typeof value === 'number' ? [{ def, value, source: limit!.source }] : [];
  });
}

/**
 * A copy of `body` with the given numbers (by ScalarLimit id) and sources (by limit name) written
 * in; limits the body lacks are not created, and `body` itself is not changed. Never throws.
 * @example withScalarLimits(body, { 'carrierSuppression/minDbBelowPep': 45 }, {}).limits.carrierSuppression.minDbBelowPep // 45
 */
export function withScalarLimits(body: RuleSetBody, values: Record<string, number>, sources: Partial<Record<keyof Limits, string>>): RuleSetBody {
  const limits = JSON.parse(JSON.stringify(body.limits)) as Record<string, Record<string, unknown> | undefined>;
  for (const def of SCALAR_LIMITS) {
    const limit = limits[def.limit];
    if (limit && typeof limit[def.field] === 'number' && def.id in values) limit[def.field] = values[def.id];
  }
  for (const [name, source] of Object.entries(sources)) {
    const limit = limits[name];
    if (limit && source !== undefined) limit['source'] = source;
  }
  // The body is plain JSON (it is stored as JSONB), so a JSON round trip is a deep copy.
  return { ...(JSON.parse(JSON.stringify(body)) as RuleSetBody), limits: limits as Limits };
}
