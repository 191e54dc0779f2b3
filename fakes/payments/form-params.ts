import { invalidParam, missingParam } from './api-error';

/**
 * A decoded form body or query (qs "extended" syntax): nested brackets become objects and
 * arrays; every leaf is a string, as on the wire.
 */
export type FormBody = { [key: string]: unknown };

/**
 * Rejects parameters the endpoint does not know, as the real API does ("Received unknown
 * parameter: x", from memory) — so a typo fails here instead of only after going live.
 * `expand` is accepted everywhere.
 *
 * @param body - the decoded parameters at one nesting level.
 * @param allowed - known names at that level.
 * @param prefix - the parent parameter for nested levels, e.g. 'line_items[0]'.
 * @throws ApiError 400 with `param` naming the first unknown key.
 */
export function rejectUnknownParams(body: FormBody, allowed: readonly string[], prefix = ''): void {
  for (const key of Object.keys(body)) {
    if (key === 'expand' && prefix === '') continue;
    if (!allowed.includes(key)) {
      const param = prefix ? `${prefix}[${key}]` : key;
      throw invalidParam(param, `Received unknown parameter: ${param}`);
    }
  }
}

/** A string parameter; undefined when absent. @throws ApiError 400 for a nested value. */
export function optionalString(body: FormBody, key: string, param = key): string | undefined {
  const value = body[key];
  if (value === undefined) return undefined;
  if (typeof value !== 'string')
    throw invalidParam(param, `Invalid string: ${JSON.stringify(value)}`);
  return value;
}

/** A string parameter that must be present and non-empty. @throws ApiError 400 otherwise. */
export function requiredString(body: FormBody, key: string, param = key): string {
  const value = optionalString(body, key, param);
  if (value === undefined || value === '') throw missingParam(param);
  return value;
}

/** A string parameter where '' means "unset" (the API's convention): '' → null. */
export function optionalNullableString(
  body: FormBody,
  key: string,
  param = key,
): string | null | undefined {
  const value = optionalString(body, key, param);
  return value === '' ? null : value;
}

/**
 * An integer parameter sent as decimal digits.
 * @throws ApiError 400 "Invalid integer: x" or when outside [min, max].
 * @example optionalInteger({ amount: '1999' }, 'amount', { min: 1 }) === 1999
 */
export function optionalInteger(
  body: FormBody,
  key: string,
  limits: { min?: number; max?: number; param?: string } = {},
): number | undefined {
  const param = limits.param ?? key;
  const text = optionalString(body, key, param);
  if (text === undefined) return undefined;
  if (!/^-?[0-9]{1,15}$/.test(text)) throw invalidParam(param, `Invalid integer: ${text}`);
  const value = Number(text);
  if (limits.min !== undefined && value < limits.min) {
    throw invalidParam(param, `This value must be greater than or equal to ${limits.min}.`);
  }
  if (limits.max !== undefined && value > limits.max) {
    throw invalidParam(param, `This value must be less than or equal to ${limits.max}.`);
  }
  return value;
}

/** One of a fixed set of strings; undefined when absent. @throws ApiError 400 otherwise. */
export function optionalEnum<T extends string>(
  body: FormBody,
  key: string,
  values: readonly T[],
  param = key,
): T | undefined {
  const value = optionalString(body, key, param);
  if (value === undefined) return undefined;
  if (!(values as readonly string[]).includes(value)) {
    throw invalidParam(param, `Invalid ${param}: must be one of ${values.join(', ')}`);
  }
  return value as T;
}

/** 'true' / 'false' as sent by the SDK for booleans. @throws ApiError 400 otherwise. */
export function optionalBoolean(body: FormBody, key: string, param = key): boolean | undefined {
  const value = optionalEnum(body, key, ['true', 'false'] as const, param);
  return value === undefined ? undefined : value === 'true';
}

/** A nested object parameter (`key[child]=…`). @throws ApiError 400 for a plain string. */
export function optionalObject(body: FormBody, key: string, param = key): FormBody | undefined {
  const value = body[key];
  if (value === undefined) return undefined;
  if (typeof value !== 'object' || value === null || Array.isArray(value)) {
    throw invalidParam(param, `Invalid object`);
  }
  return value as FormBody;
}

/**
 * An array parameter (`key[0]=…&key[1]=…`). qs turns indices above its array limit into object
 * keys, so an object whose keys are all indices is read as an array too, in index order.
 * @throws ApiError 400 "Invalid array" for anything else.
 */
export function optionalArray(body: FormBody, key: string, param = key): unknown[] | undefined {
  const value = body[key];
  if (value === undefined) return undefined;
  if (Array.isArray(value)) return value;
  if (
    typeof value === 'object' &&
    value !== null &&
    Object.keys(value).every((k) => /^[0-9]+$/.test(k))
  ) {
    return Object.entries(value)
      .sort(([a], [b]) => Number(a) - Number(b))
      .map(([, item]) => item);
  }
  throw invalidParam(param, 'Invalid array');
}

/** A loose e-mail check (something@domain.tld), enough to catch swapped fields. */
export function isPlausibleEmail(value: string): boolean {
  return /^[^\s@]+@[^\s@]+\.[^\s@]+$/.test(value) && value.length <= 512;
}

/** The `expand` list of a request (query or body); [] when absent. */
export function expandParam(source: FormBody): string[] {
  const list = optionalArray(source, 'expand') ?? [];
  return list.map((entry, index) => {
    if (typeof entry !== 'string') throw invalidParam(`expand[${index}]`, 'Invalid string');
    return entry;
  });
}
