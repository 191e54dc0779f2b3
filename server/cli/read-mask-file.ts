import fs from 'node:fs/promises';
import path from 'node:path';
import Ajv from 'ajv';
import { jsonSyntaxErrorOffset } from '../../shared/import/json-syntax-error-offset';
import { lineColumnAt } from '../../shared/import/text-position';
import type { EmissionMask } from '../../shared/mask/emission-mask';
import { inputError } from './cli-error';

/** JSON Schema of a mask file: limits in dB (<= 0) re the reference at offsets (Hz, >= 0). */
export const MASK_FILE_SCHEMA = {
  type: 'object',
  required: ['reference', 'vertices'],
  additionalProperties: false,
  properties: {
    $schema: { type: 'string' },
    name: { type: 'string' },
    source: { type: 'string' },
    edition: { type: 'string' },
    reference: { enum: ['pep', 'mean'] },
    exemptWithinOffsetHz: { type: 'number', minimum: 0 },
    vertices: {
      type: 'array',
      minItems: 1,
      items: {
        type: 'array',
        items: [
          { type: 'number', minimum: 0 },
          { type: 'number', maximum: 0 },
        ],
        minItems: 2,
        additionalItems: false,
      },
    },
  },
} as const;

const validate = new Ajv({ allErrors: false, strict: true }).compile(MASK_FILE_SCHEMA);

/**
 * Reads and validates a mask file `{"reference":"pep","vertices":[[offsetHz, relDb], ...]}`
 * (symmetric about the centre; vertex order and steps are checked by the mask engine). Bad JSON
 * names its line and column; a schema violation names the JSON path, e.g.
 * `mask.json: /vertices/2/1 must be <= 0`.
 */
export async function readMaskFile(file: string): Promise<EmissionMask> {
  const name = path.basename(file);
  const text = await fs.readFile(file, 'utf8');
  let document: unknown;
  try {
    document = JSON.parse(text);
  } catch {
    const at = lineColumnAt(text, jsonSyntaxErrorOffset(text) ?? 0);
    throw inputError(`${name}: line ${at.line}, column ${at.column}: not valid JSON`);
  }
  if (!validate(document)) {
    const error = validate.errors?.[0];
    const where = error?.instancePath === '' ? 'the mask' : error?.instancePath;
    const detail =
      error?.keyword === 'additionalProperties'
        ? `unknown member "${String(error.params['additionalProperty'])}"`
        : (error?.message ?? 'is invalid');
    const expected = '{"reference":"pep"|"mean","vertices":[[offsetHz, relDb<=0], ...]}';
    throw inputError(`${name}: ${where} ${detail} (expected ${expected})`);
  }
  const mask = document as unknown as EmissionMask & { name?: string };
  const { reference, vertices, exemptWithinOffsetHz } = mask;
  const exempt = exemptWithinOffsetHz !== undefined && { exemptWithinOffsetHz };
  return { reference, vertices, ...exempt };
}
