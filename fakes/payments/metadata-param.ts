import type { Metadata } from './api-objects';
import { invalidParam } from './api-error';
import type { FormBody } from './form-params';

/**
 * Reads a `metadata` parameter with the API's documented limits (from memory): at most 50 keys,
 * keys up to 40 characters, values up to 500 characters, no square brackets in keys.
 * `metadata=''` means "clear all" and yields null; a key sent as '' means "delete this key".
 *
 * @param body - the parameters holding `metadata`.
 * @param param - the parameter's full name for error messages.
 * @returns the update, null to clear all, undefined when absent.
 * @throws ApiError 400 naming the offending key.
 * @example readMetadata({ metadata: { order: '42' } }) // { order: '42' }
 */
export function readMetadata(body: FormBody, param = 'metadata'): Metadata | null | undefined {
  const value = body['metadata'];
  if (value === undefined) return undefined;
  if (value === '') return null;
  if (typeof value !== 'object' || value === null || Array.isArray(value)) {
    throw invalidParam(param, 'Invalid object');
  }
  const entries = Object.entries(value as FormBody);
  if (entries.length > 50) throw invalidParam(param, 'You can specify up to 50 keys.');
  const metadata: Metadata = {};
  for (const [key, entry] of entries) {
    if (typeof entry !== 'string') throw invalidParam(`${param}[${key}]`, 'Invalid string');
    if (key.length > 40 || /[[\]]/.test(key)) {
      throw invalidParam(
        `${param}[${key}]`,
        'Metadata keys can have up to 40 characters and no brackets.',
      );
    }
    if (entry.length > 500) {
      throw invalidParam(`${param}[${key}]`, 'Metadata values can have up to 500 characters.');
    }
    metadata[key] = entry;
  }
  return metadata;
}

/**
 * Merges a metadata update into the current metadata: keys sent as '' are removed, null clears.
 *
 * @example applyMetadata({ a: '1', b: '2' }, { b: '', c: '3' }) // { a: '1', c: '3' }
 */
export function applyMetadata(current: Metadata, update: Metadata | null | undefined): Metadata {
  if (update === undefined) return current;
  if (update === null) return {};
  const merged: Metadata = { ...current };
  for (const [key, value] of Object.entries(update)) {
    if (value === '') delete merged[key];
    else merged[key] = value;
  }
  return merged;
}
