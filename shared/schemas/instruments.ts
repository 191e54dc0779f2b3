/**
 * The equipment register's payloads: an instrument with its calibration and the uncertainty
 * contributions its certificate supports, and the set of instruments used on a run.
 */
import type { RuleSetBody } from '../rules/rule-set';
import type { UncertaintyContribution } from '../uncertainty/uncertainty-contribution';
import { isoDate, text, uuid } from './common';
import { uncertaintyContributionProperties } from './rule-set';

/** The budgets of a rule set an instrument's contribution can join (RuleSetBody['uncertainty']). */
export const INSTRUMENT_BUDGETS = ['relative', 'absolute', 'frequencyHz', 'bandwidthHz'] as const satisfies readonly (keyof RuleSetBody['uncertainty'])[];
export type InstrumentBudget = (typeof INSTRUMENT_BUDGETS)[number];

/** A contribution from an instrument's certificate or specification, tagged with the budget it joins. */
export interface InstrumentContribution extends UncertaintyContribution {
  budget: InstrumentBudget;
}

/** Calibration status: 'due-soon' when due within CALIBRATION_DUE_SOON_DAYS, 'overdue' once past the due date. */
export const CALIBRATION_STATUSES = ['valid', 'due-soon', 'overdue'] as const;
export type CalibrationStatus = (typeof CALIBRATION_STATUSES)[number];

export interface InstrumentBody {
  name: string;
  model: string;
  serialNumber: string;
  calibratedOn: string;
  calibrationDue: string;
  certificateRef: string;
  contributions: InstrumentContribution[];
}

/** For POST /instruments and PUT /instruments/:id (a PUT replaces the whole record). */
export const instrumentSchema = {
  type: 'object',
  additionalProperties: false,
  required: ['name', 'model', 'serialNumber', 'calibratedOn', 'calibrationDue', 'certificateRef', 'contributions'],
  properties: {
    name: text(200),
    model: text(200),
    serialNumber: text(100),
    calibratedOn: isoDate,
    calibrationDue: isoDate,
    certificateRef: text(200),
    contributions: {
      type: 'array',
      maxItems: 20,
      items: {
        type: 'object',
        additionalProperties: false,
        required: ['name', 'distribution', 'value', 'budget'],
        properties: { ...uncertaintyContributionProperties, budget: { enum: [...INSTRUMENT_BUDGETS] } },
      },
    },
  },
} as const;

export interface RunInstrumentsBody {
  instrumentIds: string[];
}

/** For PUT /runs/:id/instruments: the whole set of instruments used (an empty list clears it). */
export const runInstrumentsSchema = {
  type: 'object',
  additionalProperties: false,
  required: ['instrumentIds'],
  properties: { instrumentIds: { type: 'array', maxItems: 30, uniqueItems: true, items: uuid } },
} as const;
