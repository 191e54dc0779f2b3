/**
 * Request bodies of the billing API (report credits): the lab's price list, a manufacturer's
 * checkout of one pack, and a lab's manual adjustment of a client's balance.
 */
import { text, uuid } from './common';

/**
 * Currencies a lab may price credits in, with the ISO 4217 minor unit of each (the number of
 * decimals between the minor unit and the major unit: 2 for pence or cents, 0 for yen; from
 * memory). Prices are always whole minor units, as the payment API takes them.
 */
export const CURRENCY_MINOR_UNITS = {
  GBP: 2,
  EUR: 2,
  USD: 2,
  CHF: 2,
  SEK: 2,
  NOK: 2,
  DKK: 2,
  PLN: 2,
  CAD: 2,
  AUD: 2,
  JPY: 0,
} as const;

export type CreditCurrency = keyof typeof CURRENCY_MINOR_UNITS;
export const CREDIT_CURRENCIES = Object.keys(CURRENCY_MINOR_UNITS) as CreditCurrency[];

/** Largest amount the payment API accepts in one line, in minor units (99 999 999, from memory). */
export const MAX_AMOUNT_MINOR = 99_999_999;
/** Most credits in one pack, and most packs in one list (common practice: a short price list). */
export const MAX_PACK_CREDITS = 1000;
export const MAX_PACKS = 10;

/** A pack is named by its size: "pack-5" holds 5 credits (a list has one pack per size). */
export const packIdFor = (credits: number): string => `pack-${credits}`;
export const PACK_ID_PATTERN = '^pack-[1-9][0-9]{0,3}$';

export interface PriceListBody {
  currency: CreditCurrency;
  packs: { credits: number; priceMinor: number }[];
  /** A withdrawn report's credit is returned when withdrawn within this many days of issue. */
  refundOnWithdrawWithinDays?: number;
}

export const priceListSchema = {
  type: 'object',
  additionalProperties: false,
  required: ['currency', 'packs'],
  properties: {
    currency: { enum: CREDIT_CURRENCIES },
    packs: {
      type: 'array',
      minItems: 1,
      maxItems: MAX_PACKS,
      items: {
        type: 'object',
        additionalProperties: false,
        required: ['credits', 'priceMinor'],
        properties: {
          credits: { type: 'integer', minimum: 1, maximum: MAX_PACK_CREDITS },
          priceMinor: { type: 'integer', minimum: 1, maximum: MAX_AMOUNT_MINOR },
        },
      },
    },
    refundOnWithdrawWithinDays: { type: 'integer', minimum: 0, maximum: 365 },
  },
} as const;

export interface CheckoutBody {
  labId: string;
  packId: string;
}

export const checkoutSchema = {
  type: 'object',
  additionalProperties: false,
  required: ['labId', 'packId'],
  properties: {
    labId: uuid,
    packId: { type: 'string', pattern: PACK_ID_PATTERN, maxLength: 9 },
  },
} as const;

export interface CreditAdjustmentBody {
  clientId: string;
  /** Credits to add (positive) or take away (negative); never zero. */
  credits: number;
  reason: string;
}

export const creditAdjustmentSchema = {
  type: 'object',
  additionalProperties: false,
  required: ['clientId', 'credits', 'reason'],
  properties: {
    clientId: uuid,
    credits: {
      type: 'integer',
      minimum: -MAX_PACK_CREDITS,
      maximum: MAX_PACK_CREDITS,
      not: { const: 0 },
    },
    reason: text(500),
  },
} as const;
