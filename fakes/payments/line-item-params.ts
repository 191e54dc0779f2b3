import { invalidParam, missingParam } from './api-error';
import type { Metadata } from './api-objects';
import {
  optionalInteger,
  optionalObject,
  optionalString,
  rejectUnknownParams,
  type FormBody,
} from './form-params';
import { readMetadata } from './metadata-param';

/** One validated line item of a new session (ad-hoc `price_data`, as Sidecheck sends). */
export type LineItemDraft = {
  name: string;
  description: string | null;
  productMetadata: Metadata;
  unitAmount: number;
  quantity: number;
};

/**
 * Validates one `line_items[i]` entry of a new Checkout Session: `price_data` with a 3-letter
 * currency, an integer `unit_amount` 0–99 999 999 minor units and `product_data[name]`, plus an
 * integer `quantity` ≥ 1 (the API's rules as far as Sidecheck uses them, from memory).
 *
 * @param raw - the decoded entry.
 * @param param - its parameter name, e.g. 'line_items[0]', for error messages.
 * @returns the draft with its lower-cased currency.
 * @throws ApiError 400 naming the offending nested parameter.
 * @example readLineItem({ price_data: { currency: 'EUR', unit_amount: '1999',
 *   product_data: { name: 'Plan' } }, quantity: '1' }, 'line_items[0]').currency === 'eur'
 */
export function readLineItem(raw: unknown, param: string): LineItemDraft & { currency: string } {
  if (typeof raw !== 'object' || raw === null) throw invalidParam(param, 'Invalid object');
  const item = raw as FormBody;
  rejectUnknownParams(item, ['price_data', 'quantity'], param);
  if (item['price_data'] === undefined) throw missingParam(`${param}[price_data]`);
  const priceData = optionalObject(item, 'price_data', `${param}[price_data]`) ?? {};
  rejectUnknownParams(
    priceData,
    ['currency', 'unit_amount', 'product_data'],
    `${param}[price_data]`,
  );
  const currency = (
    optionalString(priceData, 'currency', `${param}[price_data][currency]`) ?? ''
  ).toLowerCase();
  if (!/^[a-z]{3}$/.test(currency)) throw missingParam(`${param}[price_data][currency]`);
  const unitAmount = optionalInteger(priceData, 'unit_amount', {
    min: 0,
    max: 99_999_999,
    param: `${param}[price_data][unit_amount]`,
  });
  if (unitAmount === undefined) throw missingParam(`${param}[price_data][unit_amount]`);
  const productData = optionalObject(
    priceData,
    'product_data',
    `${param}[price_data][product_data]`,
  );
  if (!productData) throw missingParam(`${param}[price_data][product_data]`);
  rejectUnknownParams(
    productData,
    ['name', 'description', 'metadata'],
    `${param}[price_data][product_data]`,
  );
  const name = optionalString(productData, 'name', `${param}[price_data][product_data][name]`);
  if (!name) throw missingParam(`${param}[price_data][product_data][name]`);
  const quantity = optionalInteger(item, 'quantity', {
    min: 1,
    max: 999_999,
    param: `${param}[quantity]`,
  });
  if (quantity === undefined) throw missingParam(`${param}[quantity]`);
  return {
    currency,
    name,
    description: optionalString(productData, 'description') || null,
    productMetadata:
      readMetadata(productData, `${param}[price_data][product_data][metadata]`) ?? {},
    unitAmount,
    quantity,
  };
}
