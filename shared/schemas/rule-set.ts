/**
 * JSON Schema of a rule set's body (shared/rules/rule-set.ts) and of the requests that copy or
 * edit one, plus the checks JSON Schema cannot express (vertex offsets in order, low below high).
 * The client's rule-set editor and the server's validation use the same definitions.
 */
import type { RuleSetBody } from '../rules/rule-set';
import { finite, text } from './common';

/** One uncertainty contribution (shared/uncertainty/uncertainty-contribution.ts), GUM §4.3. */
export const uncertaintyContributionProperties = {
  name: text(200),
  distribution: { enum: ['normal', 'rectangular', 'u-shaped', 'triangular'] },
  value: finite(0, 1e9),
  coverageFactor: { type: 'number', exclusiveMinimum: 0, maximum: 10 },
  sensitivity: finite(-1e6, 1e6),
} as const;

export const uncertaintyContributionSchema = {
  type: 'object',
  additionalProperties: false,
  required: ['name', 'distribution', 'value'],
  properties: uncertaintyContributionProperties,
} as const;

const budget = { type: 'array', maxItems: 50, items: uncertaintyContributionSchema } as const;
const source = text(500);
const guardBand = { anyOf: [{ const: 'expanded-uncertainty' }, finite(0, 100)] } as const;
const limit = <P extends Record<string, object>>(required: (keyof P & string)[], properties: P) =>
  ({ type: 'object', additionalProperties: false, required: ['source', ...required], properties: { source, ...properties } }) as const;

/** ILAC-G8:09/2019 decision rules (shared/uncertainty/decision-rule.ts). */
export const decisionRuleSchema = {
  oneOf: [
    { type: 'object', additionalProperties: false, required: ['kind'], properties: { kind: { const: 'simple-acceptance' } } },
    { type: 'object', additionalProperties: false, required: ['kind', 'guardBand'], properties: { kind: { const: 'binary-guard-band' }, guardBand } },
    { type: 'object', additionalProperties: false, required: ['kind', 'guardBand'], properties: { kind: { const: 'non-binary' }, guardBand } },
  ],
} as const;

/** A mask vertex: [offsetHz from the assigned frequency (>= 0), limit in dB relative to the reference (<= 0)]. */
const maskVertex = {
  type: 'array',
  items: [finite(0, 1e9), finite(-300, 0)],
  minItems: 2,
  additionalItems: false,
} as const;

export const ruleSetBodySchema = {
  type: 'object',
  additionalProperties: false,
  required: ['service', 'description', 'references', 'decisionRule', 'limits', 'uncertainty'],
  properties: {
    service: { enum: ['maritime', 'aeronautical', 'land-mobile', 'amateur', 'broadcast', 'other'] },
    description: text(2000, 0),
    references: {
      type: 'array',
      maxItems: 50,
      items: {
        type: 'object',
        additionalProperties: false,
        required: ['document', 'edition'],
        properties: { document: text(200), clause: text(100, 0), edition: text(100) },
      },
    },
    sampleNotice: text(1000, 0),
    decisionRule: decisionRuleSchema,
    limits: {
      type: 'object',
      additionalProperties: false,
      properties: {
        carrierSuppression: limit(['minDbBelowPep'], { minDbBelowPep: finite(0, 200) }),
        unwantedSideband: limit(['minDb'], { minDb: finite(0, 200) }),
        intermodulation: limit(['minDbBelowPep'], { minDbBelowPep: finite(0, 200) }),
        emissionMask: limit(['reference', 'vertices'], {
          reference: { enum: ['pep', 'mean'] },
          vertices: { type: 'array', minItems: 2, maxItems: 200, items: maskVertex },
          assignedOffsetHz: finite(-1e6, 1e6),
          referenceBandwidthHz: { type: 'number', exclusiveMinimum: 0, maximum: 1e9 },
        }),
        spurious: limit(['baseDb', 'reference', 'referenceBandwidthHz'], {
          baseDb: finite(0, 200),
          capDbc: finite(0, 200),
          capRule: { enum: ['less-stringent', 'more-stringent'] },
          reference: { enum: ['pep', 'mean'] },
          referenceBandwidthHz: { type: 'number', exclusiveMinimum: 0, maximum: 1e9 },
        }),
        occupiedBandwidth: limit(['maxHz'], { maxHz: { type: 'number', exclusiveMinimum: 0, maximum: 1e9 } }),
        frequencyTolerance: limit(['toleranceHz'], { toleranceHz: finite(0, 1e9) }),
        audioResponse: limit(['lowHz', 'highHz', 'maxVariationDb'], { lowHz: finite(0, 1e6), highHz: finite(0, 1e6), maxVariationDb: finite(0, 100) }),
      },
    },
    uncertainty: {
      type: 'object',
      additionalProperties: false,
      required: ['relative', 'absolute'],
      properties: { relative: budget, absolute: budget, frequencyHz: budget, bandwidthHz: budget },
    },
  },
} as const;

export interface CopyRuleSetBody {
  name: string;
}

export const copyRuleSetSchema = {
  type: 'object',
  additionalProperties: false,
  required: ['name'],
  properties: { name: text(200) },
} as const;

export interface EditRuleSetBody {
  name?: string;
  body: RuleSetBody;
}

export const editRuleSetSchema = {
  type: 'object',
  additionalProperties: false,
  required: ['body'],
  properties: { name: text(200), body: ruleSetBodySchema },
} as const;

/** A problem ajv cannot express, with the JSON pointer of the field at fault. */
export interface RuleSetBodyProblem {
  pointer: string;
  message: string;
}

/**
 * The semantic checks on a schema-valid body: mask vertex offsets must not decrease (equal
 * offsets make a vertical step, as in 47 CFR 80.211(a)), and an audio band's low edge must lie
 * below its high edge. `base` prefixes every pointer (e.g. "/body" inside an edit request).
 * Returns [] when the body is sound; never throws on a schema-valid body.
 *
 * @example ruleSetBodyProblems({ ...body, limits: { emissionMask: { ..., vertices: [[1500, 0], [1000, -28]] } } }, '/body')
 * // [{ pointer: '/body/limits/emissionMask/vertices/1/0', message: 'must not be below the previous offset (1500 Hz)' }]
 */
export function ruleSetBodyProblems(body: RuleSetBody, base = ''): RuleSetBodyProblem[] {
  const problems: RuleSetBodyProblem[] = [];
  const vertices = body.limits.emissionMask?.vertices ?? [];
  for (let i = 1; i < vertices.length; i++) {
    if (vertices[i][0] < vertices[i - 1][0]) {
      problems.push({ pointer: `${base}/limits/emissionMask/vertices/${i}/0`, message: `must not be below the previous offset (${vertices[i - 1][0]} Hz)` });
    }
  }
  const audio = body.limits.audioResponse;
  if (audio && audio.highHz <= audio.lowHz) {
    problems.push({ pointer: `${base}/limits/audioResponse/highHz`, message: `must be above the low edge (${audio.lowHz} Hz)` });
  }
  const spurious = body.limits.spurious;
  if (spurious?.capRule !== undefined && spurious.capDbc === undefined) {
    problems.push({ pointer: `${base}/limits/spurious/capDbc`, message: 'is required when a cap rule is given' });
  }
  return problems;
}
