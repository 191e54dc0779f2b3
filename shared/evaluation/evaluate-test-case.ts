/**
 * From a test case's readings and its rule set to a result with margin, uncertainty and verdict.
 * Pure: the browser calls it as values are typed, the server calls it on save and stores what it
 * returns, with ENGINE_VERSION. Measurements that need a trace or a set of audio points (emission
 * mask, audio response) are evaluated from imports, not from hand readings.
 */
import type { RuleSetBody } from '../rules/rule-set';
import type { TestKind } from '../rules/test-kind';
import { carrierSuppressionDb } from '../measurements/carrier-suppression';
import { unwantedSidebandSuppressionDb } from '../measurements/unwanted-sideband-suppression';
import { imdRelativeDb } from '../measurements/imd-relative';
import { spuriousLimitDb } from '../measurements/spurious-limit';
import { frequencyErrorHz, frequencyErrorPpm } from '../measurements/frequency-error';
import { dbmToWatts } from '../units/power-level-conversions';
import { combineUncertainty } from '../uncertainty/combine-uncertainty';
import type { UncertaintyContribution } from '../uncertainty/uncertainty-contribution';
import { applyDecisionRule } from '../uncertainty/decision-rule';
import { describeDecisionRule } from '../uncertainty/describe-decision-rule';
import type { TestCaseResult } from './test-case-result';
import { READING_FIELDS, type ReadingValues } from './reading-fields';

/** A reading or rule set that cannot be evaluated; the message is for the person at the bench. */
export class EvaluationError extends Error {}

/** Which uncertainty budget of the rule set a measured quantity joins. */
export type Budget = keyof RuleSetBody['uncertainty'];

/** A measured quantity with its limit, before uncertainty and the decision rule are applied. */
export interface Measured {
  value: number;
  unit: string;
  limit: number;
  limitText: string;
  direction: 'at-least' | 'at-most';
  detail: TestCaseResult['detail'];
  budget: Budget;
}

const num = (readings: ReadingValues, key: string) => readings[key] as number;
const round = (x: number, digits = 2) => Number(x.toFixed(digits));

function requireReadings(readings: ReadingValues, kind: TestKind): void {
  const fields = READING_FIELDS[kind];
  if (fields.length === 0) throw new EvaluationError('This measurement is evaluated from an imported trace, not from hand readings.');
  for (const field of fields) {
    const v = readings[field.key];
    const present = v !== null && v !== undefined && v !== '';
    if ((!field.optional || present) && (typeof v !== 'number' || !Number.isFinite(v))) {
      throw new EvaluationError(`${field.label} is required and must be a finite number.`);
    }
  }
}

/** The rule set's limit of one kind, or an EvaluationError naming what is missing. */
export function limitOf<K extends keyof RuleSetBody['limits']>(rules: RuleSetBody, key: K, what: string): NonNullable<RuleSetBody['limits'][K]> {
  const limit = rules.limits[key];
  if (!limit) throw new EvaluationError(`The rule set has no ${what} limit.`);
  return limit as NonNullable<RuleSetBody['limits'][K]>;
}

function measure(kind: TestKind, r: ReadingValues, rules: RuleSetBody): Measured {
  switch (kind) {
    case 'carrier-suppression': {
      const limit = limitOf(rules, 'carrierSuppression', 'carrier-suppression');
      return {
        value: carrierSuppressionDb({ pepDbm: num(r, 'pepDbm'), carrierDbm: num(r, 'carrierDbm') }),
        unit: 'dB below PEP',
        limit: limit.minDbBelowPep,
        limitText: `at least ${limit.minDbBelowPep} dB below PEP (${limit.source})`,
        direction: 'at-least',
        detail: { pepDbm: num(r, 'pepDbm'), carrierDbm: num(r, 'carrierDbm') },
        budget: 'relative',
      };
    }
    case 'unwanted-sideband': {
      const limit = limitOf(rules, 'unwantedSideband', 'unwanted-sideband');
      return {
        value: unwantedSidebandSuppressionDb({ wantedToneDbm: num(r, 'wantedToneDbm'), imageToneDbm: num(r, 'imageToneDbm') }),
        unit: 'dB below the wanted tone',
        limit: limit.minDb,
        limitText: `at least ${limit.minDb} dB below the wanted sideband (${limit.source})`,
        direction: 'at-least',
        detail: { wantedToneDbm: num(r, 'wantedToneDbm'), imageToneDbm: num(r, 'imageToneDbm') },
        budget: 'relative',
      };
    }
    case 'intermodulation': {
      const limit = limitOf(rules, 'intermodulation', 'intermodulation');
      const tone = num(r, 'toneDbm');
      const imd3 = imdRelativeDb({ productDbm: num(r, 'imd3Dbm'), toneDbm: tone });
      const imd5 = typeof r.imd5Dbm === 'number' ? imdRelativeDb({ productDbm: r.imd5Dbm, toneDbm: tone }) : null;
      // The worse (smaller) suppression of the orders measured decides.
      const worst = imd5 && imd5.belowPepDb < imd3.belowPepDb ? imd5 : imd3;
      return {
        value: worst.belowPepDb,
        unit: 'dB below PEP',
        limit: limit.minDbBelowPep,
        limitText: `products at least ${limit.minDbBelowPep} dB below PEP (${limit.source})`,
        direction: 'at-least',
        detail: {
          toneDbm: tone,
          pepDbm: round(tone + 20 * Math.log10(2), 4),
          imd3BelowPepDb: round(imd3.belowPepDb, 4),
          imd3BelowToneDb: round(imd3.belowToneDb, 4),
          imd5BelowPepDb: imd5 ? round(imd5.belowPepDb, 4) : null,
          decidingOrder: worst === imd3 ? 3 : 5,
        },
        budget: 'relative',
      };
    }
    case 'spurious': {
      const limit = limitOf(rules, 'spurious', 'spurious-emission');
      const meanDbm = num(r, 'meanPowerDbm');
      const required = spuriousLimitDb({ meanPowerW: dbmToWatts(meanDbm), baseDb: limit.baseDb, capDbc: limit.capDbc, capRule: limit.capRule });
      return {
        value: meanDbm - num(r, 'worstSpuriousDbm'),
        unit: `dB below ${limit.reference === 'pep' ? 'PEP' : 'mean power'}`,
        limit: required,
        limitText: `at least ${round(required)} dB below ${limit.reference === 'pep' ? 'PEP' : 'mean power'} (${limit.baseDb} + 10 log10(P/W), ${limit.source})`,
        direction: 'at-least',
        detail: { meanPowerDbm: meanDbm, meanPowerW: round(dbmToWatts(meanDbm), 4), worstSpuriousDbm: num(r, 'worstSpuriousDbm'), referenceBandwidthHz: limit.referenceBandwidthHz },
        budget: 'relative',
      };
    }
    case 'occupied-bandwidth': {
      const limit = limitOf(rules, 'occupiedBandwidth', 'occupied-bandwidth');
      return {
        value: num(r, 'occupiedBandwidthHz'),
        unit: 'Hz',
        limit: limit.maxHz,
        limitText: `at most ${limit.maxHz} Hz (${limit.source})`,
        direction: 'at-most',
        detail: { occupiedBandwidthHz: num(r, 'occupiedBandwidthHz') },
        budget: 'bandwidthHz',
      };
    }
    case 'frequency-tolerance': {
      const limit = limitOf(rules, 'frequencyTolerance', 'frequency-tolerance');
      const reading = { measuredHz: num(r, 'measuredHz'), nominalHz: num(r, 'nominalHz') };
      return {
        value: Math.abs(frequencyErrorHz(reading)),
        unit: 'Hz',
        limit: limit.toleranceHz,
        limitText: `within ±${limit.toleranceHz} Hz (${limit.source})`,
        direction: 'at-most',
        detail: { errorHz: round(frequencyErrorHz(reading), 3), errorPpm: round(frequencyErrorPpm(reading), 4) },
        budget: 'frequencyHz',
      };
    }
    default:
      throw new EvaluationError('This measurement is evaluated from an imported trace, not from hand readings.');
  }
}

export function evaluateTestCase(input: {
  kind: TestKind;
  readings: ReadingValues;
  rules: RuleSetBody;
  /**
   * Extra contributions from the instruments used (their calibration certificates): a list joins
   * the budget of the measured quantity; a record per budget adds only the entry of that budget.
   */
  instrumentContributions?: UncertaintyContribution[] | Partial<Record<Budget, UncertaintyContribution[]>>;
}): TestCaseResult {
  requireReadings(input.readings, input.kind);
  return concludeMeasurement(input.kind, measure(input.kind, input.readings, input.rules), input.rules, input.instrumentContributions);
}

/**
 * The shared last step for hand readings and imported traces alike: the measured quantity's
 * budget (rule set plus instruments) combined per GUM with k = 2, then the rule set's ILAC-G8
 * decision rule. Throws EvaluationError when the rule set has no budget for the quantity.
 */
export function concludeMeasurement(
  kind: TestKind,
  m: Measured,
  rules: RuleSetBody,
  extra?: UncertaintyContribution[] | Partial<Record<Budget, UncertaintyContribution[]>>,
): TestCaseResult {
  const fromInstruments = Array.isArray(extra) ? extra : (extra?.[m.budget] ?? []);
  const budget = [...(rules.uncertainty[m.budget] ?? []), ...fromInstruments];
  if (budget.length === 0) throw new EvaluationError(`The rule set has no uncertainty budget for ${m.unit} readings; add one before evaluating.`);
  const uncertainty = combineUncertainty(budget, { coverageFactor: 2 });
  const decision = applyDecisionRule({ value: m.value, limit: m.limit, direction: m.direction, expandedUncertainty: uncertainty.expanded, rule: rules.decisionRule });
  return {
    kind,
    value: m.value,
    unit: m.unit,
    limit: m.limit,
    limitText: m.limitText,
    direction: m.direction,
    margin: decision.marginDb,
    uncertainty,
    verdict: decision.verdict,
    decisionRuleText: describeDecisionRule(rules.decisionRule),
    detail: m.detail,
  };
}
