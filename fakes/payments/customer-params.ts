import { invalidParam } from './api-error';
import type { Customer } from './api-objects';
import { readAddress } from './address-param';
import {
  isPlausibleEmail,
  optionalArray,
  optionalNullableString,
  type FormBody,
} from './form-params';
import { applyMetadata, readMetadata } from './metadata-param';

/**
 * Applies the writable customer parameters (address, description, email, metadata, name, phone,
 * preferred_locales) to a customer, with the API's conventions (from memory): '' unsets a field,
 * metadata merges key by key.
 *
 * @param customer - the customer to change (mutated and returned).
 * @param body - the decoded parameters, unknown names already rejected.
 * @returns the same customer.
 * @throws ApiError 400 for an implausible e-mail or malformed values.
 * @example applyCustomerParams(customer, { phone: '' }).phone === null
 */
export function applyCustomerParams(customer: Customer, body: FormBody): Customer {
  const email = optionalNullableString(body, 'email');
  if (email && !isPlausibleEmail(email))
    throw invalidParam('email', `Invalid email address: ${email}`, 'email_invalid');
  for (const field of ['description', 'name', 'phone'] as const) {
    const value = optionalNullableString(body, field);
    if (value !== undefined) customer[field] = value;
  }
  if (email !== undefined) customer.email = email;
  const address = readAddress(body);
  if (address !== undefined) customer.address = address;
  const locales = optionalArray(body, 'preferred_locales');
  if (locales !== undefined) customer.preferred_locales = locales.map(String);
  customer.metadata = applyMetadata(customer.metadata, readMetadata(body));
  return customer;
}
