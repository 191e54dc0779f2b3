import { validate } from '../http/validation';
import { validationFailed } from '../http/problem';
import { NUMERIC_UPLOAD_FIELDS } from '../../shared/schemas/uploads';

const NUMBER_TEXT = /^[-+]?(?:\d+\.?\d*|\.\d+)(?:e[-+]?\d+)?$/i;

/**
 * The text fields of a multipart upload as typed values, validated against `schema` (from
 * shared/schemas/uploads.ts). Multipart carries text only: a numeric field whose text is a plain
 * decimal number becomes that number (anything else stays text, and the schema then says "must
 * be number"); `sideband` is lower-cased, so "USB" from a test plan reads as "usb". A field sent
 * twice is refused rather than one of its values picked.
 *
 * @throws Problem 422 naming every field at fault.
 * @example readUploadFields({ referenceDbm: '47.5', sideband: 'USB' }, uploadFieldsSchema)
 * // { referenceDbm: 47.5, sideband: 'usb' }
 */
export function readUploadFields<T>(raw: Record<string, unknown>, schema: object): T {
  // No prototype: a field named __proto__ stays an ordinary (unknown, so refused) field.
  const typed: Record<string, unknown> = Object.create(null);
  for (const [name, value] of Object.entries(raw)) {
    if (typeof value !== 'string') throw validationFailed(`The field "${name}" must be sent once, as text.`, [{ pointer: `/${name}`, message: 'must be sent once, as text' }]);
    const text = value.trim();
    if ((NUMERIC_UPLOAD_FIELDS as readonly string[]).includes(name)) typed[name] = NUMBER_TEXT.test(text) ? Number(text) : text;
    else typed[name] = name === 'sideband' ? text.toLowerCase() : text;
  }
  return { ...validate<object>(schema, typed, 'The upload') } as T;
}
