import Ajv, { type ErrorObject, type ValidateFunction } from 'ajv';
import addFormats from 'ajv-formats';
import { validationFailed, type FieldError } from './problem';

/** One Ajv for the server; schemas come from shared/schemas so the client's forms use the same. */
export const ajv = new Ajv({ allErrors: true, strict: true, coerceTypes: false, useDefaults: false });
addFormats(ajv);

const cache = new WeakMap<object, ValidateFunction>();

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

/** Validate `value` against `schema`, throwing a 422 problem that lists every field at fault. */
export function validate<T>(schema: object, value: unknown, what = 'The request'): T {
  let check = cache.get(schema);
  if (!check) {
    check = ajv.compile(schema);
    cache.set(schema, check);
  }
  if (!check(value)) {
    const errors = (check.errors ?? []).map(describe);
    const first = errors[0];
    throw validationFailed(`${what} has ${errors.length} problem${errors.length === 1 ? '' : 's'}: ${first.pointer} ${first.message}.`, errors);
  }
  return value as T;
}
