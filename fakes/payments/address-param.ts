import type { Address } from './api-objects';
import {
  rejectUnknownParams,
  optionalNullableString,
  optionalObject,
  type FormBody,
} from './form-params';

const ADDRESS_FIELDS = ['city', 'country', 'line1', 'line2', 'postal_code', 'state'] as const;

/**
 * Reads an `address[...]` parameter (city, country, line1, line2, postal_code, state).
 * `address=''` unsets the address.
 *
 * @param body - the parameters holding `address`.
 * @returns the address, null to unset, undefined when absent.
 * @throws ApiError 400 for unknown sub-fields.
 * @example readAddress({ address: { country: 'DE' } })?.country === 'DE'
 */
export function readAddress(body: FormBody): Address | null | undefined {
  if (body['address'] === '') return null;
  const value = optionalObject(body, 'address');
  if (value === undefined) return undefined;
  rejectUnknownParams(value, ADDRESS_FIELDS, 'address');
  const field = (name: (typeof ADDRESS_FIELDS)[number]) =>
    optionalNullableString(value, name, `address[${name}]`) ?? null;
  return {
    city: field('city'),
    country: field('country'),
    line1: field('line1'),
    line2: field('line2'),
    postal_code: field('postal_code'),
    state: field('state'),
  };
}
