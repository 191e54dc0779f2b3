import Ajv, { type ErrorObject, type ValidateFunction } from 'ajv';
import addFormats from 'ajv-formats';
import { validationFailed, type FieldError } from './problem';

/** One Ajv for the server; schemas come from shared/schemas so the client's forms use the same. */
export const ajv = new Ajv({ allErrors: true, strict: true, coerceTypes: false, useDefaults: false });
addFormats(ajv);

/**
 * The same schemas, stopping at the first error: a body with thousands of faults (a 50,000-key
 * object, a 100,000-item list) would otherwise cost seconds of CPU and answer with megabytes of
 * field errors. Large bodies get the first error; small ones (the forms) get every error.
 */
const firstErrorAjv = new Ajv({ allErrors: false, strict: true, coerceTypes: false, useDefaults: false });
addFormats(firstErrorAjv);

/** Bodies with more JSON values than this are reported by their first error only. */
const ALL_ERRORS_MAX_VALUES = 2000;
/** Field errors listed in one answer at most (the detail still says how many were found). */
const MAX_LISTED_ERRORS = 50;

const cache = new WeakMap<object, { first: ValidateFunction; all: ValidateFunction }>();

/** True when `value` holds at most `limit` JSON values (counting stops at the limit). */
function isSmall(value: unknown, limit: number): boolean {
  let count = 0;
  const pending: unknown[] = [value];
  while (pending.length > 0) {
    if (++count > limit) return false;
    const item = pending.pop();
    if (Array.isArray(item)) pending.push(...item.slice(0, limit));
    else if (typeof item === 'object' && item !== null) pending.push(...Object.values(item).slice(0, limit));
  }
  return true;
}

function describe(error: ErrorObject): FieldError {
  const pointer = error.instancePath || '/';
  switch (error.keyword) {
    case 'required':
      return { pointer: `${error.instancePath}/${error.params.missingProperty}`, message: 'is required' };
    case 'additionalProperties':
      return { pointer: `${error.instancePath}/${error.params.additionalProperty}`, message: 'is not a known field' };
    case 'type':
      return { pointer, message: `must be ${error.params.type}` };
    default:
      return { pointer, message: error.message ?? 'is not valid' };
  }
}

/**
 * Control characters other than tab, line feed and carriage return (C0, DEL, C1), and UTF-16
 * surrogates without their pair: no name, note or reason needs them, PostgreSQL refuses NUL in
 * text and JSON, and a lone surrogate is not Unicode at all.
 */
const UNPRINTABLE = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\u007F-\u009F]|[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;

/** Every string (and object key) of a schema-valid value that holds an UNPRINTABLE character, as field errors. */
function unprintableFields(value: unknown): FieldError[] {
  const errors: FieldError[] = [];
  const pending: [unknown, string][] = [[value, '']];
  while (pending.length > 0 && errors.length < 20) {
    const [item, pointer] = pending.pop()!;
    if (typeof item === 'string') {
      if (UNPRINTABLE.test(item)) errors.push({ pointer: pointer || '/', message: 'must not contain control characters or broken Unicode' });
    } else if (Array.isArray(item)) {
      item.forEach((element, k) => pending.push([element, `${pointer}/${k}`]));
    } else if (typeof item === 'object' && item !== null) {
      for (const [key, element] of Object.entries(item)) {
        if (UNPRINTABLE.test(key)) errors.push({ pointer: pointer || '/', message: 'must not have a field name with control characters or broken Unicode' });
        pending.push([element, `${pointer}/${key.replace(/~/g, '~0').replace(/\//g, '~1')}`]);
      }
    }
  }
  return errors;
}

/**
 * Validate `value` against `schema`, throwing a 422 problem that lists every field at fault.
 * Text that passes the schema is also refused when it holds control characters or broken Unicode.
 */
export function validate<T>(schema: object, value: unknown, what = 'The request'): T {
  let check = cache.get(schema);
  if (!check) {
    check = { first: firstErrorAjv.compile(schema), all: ajv.compile(schema) };
    cache.set(schema, check);
  }
  let errors: FieldError[];
  if (check.first(value)) errors = unprintableFields(value);
  else if (isSmall(value, ALL_ERRORS_MAX_VALUES)) errors = (check.all(value), check.all.errors ?? []).map(describe);
  else errors = (check.first.errors ?? []).map(describe);
  if (errors.length > 0) {
    const first = errors[0];
    throw validationFailed(`${what} has ${errors.length} problem${errors.length === 1 ? '' : 's'}: ${first.pointer} ${first.message}.`, errors.slice(0, MAX_LISTED_ERRORS));
  }
  return value as T;
}
