/**
 * Hostile JSON request bodies. Three kinds:
 * - RAW_BODIES: texts that are not JSON at all (bare NaN/Infinity tokens, truncation, single
 *   quotes...) or too large; every route that reads JSON must refuse them (400 / 413);
 * - SHAPE_BODIES: valid JSON of the wrong shape (arrays, strings, 10,000 levels of nesting,
 *   prototype-pollution keys); every route with a body schema must refuse them;
 * - HOSTILE_VALUES: values put into one field of an otherwise valid body (wrong types, NaN and
 *   Infinity spelled as strings and as bare tokens, 1e308, 1e999, -0 where zero is not allowed,
 *   1 MB strings, control characters, SQL where an id or a code is expected...). Each says which
 *   fields it applies to, read from the field's JSON Schema; `bodyMutations` puts every applicable
 *   value into every field of a route's valid body, and adds unknown, missing and polluting keys.
 */

/** A JSON Schema fragment as written in shared/schemas (only the keywords used there). */
export interface SchemaNode {
  type?: string | string[];
  enum?: readonly unknown[];
  const?: unknown;
  format?: string;
  pattern?: string;
  minimum?: number;
  maximum?: number;
  exclusiveMinimum?: number;
  maxLength?: number;
  maxItems?: number;
  minItems?: number;
  required?: readonly string[];
  properties?: Record<string, SchemaNode>;
  items?: SchemaNode | readonly SchemaNode[];
  anyOf?: readonly SchemaNode[];
  oneOf?: readonly SchemaNode[];
  additionalProperties?: boolean | SchemaNode;
}

const MB_STRING = JSON.stringify('a'.repeat(1_000_000));
const nest = (open: string, close: string, levels: number, inner = '1') => open.repeat(levels) + inner + close.repeat(levels);

export interface RawBody {
  label: string;
  text: string;
  /** 400: not JSON; 413: larger than the 1 MB the JSON parser accepts. */
  status: 400 | 413;
}

export const RAW_BODIES: RawBody[] = [
  { label: 'bare NaN', text: 'NaN', status: 400 },
  { label: 'bare Infinity', text: 'Infinity', status: 400 },
  { label: 'NaN token in a field', text: '{"value": NaN}', status: 400 },
  { label: 'Infinity token in a field', text: '{"value": Infinity}', status: 400 },
  { label: '-Infinity token in a field', text: '{"value": -Infinity}', status: 400 },
  { label: 'undefined token', text: '{"value": undefined}', status: 400 },
  { label: 'single quotes', text: "{'name': 'x'}", status: 400 },
  { label: 'trailing comma', text: '{"name": "x",}', status: 400 },
  { label: 'truncated object', text: '{"name": "x"', status: 400 },
  { label: 'unterminated string', text: '{"broken json', status: 400 },
  { label: 'comment in JSON', text: '{"name": "x" /* hi */}', status: 400 },
  { label: 'hex number', text: '{"value": 0x10}', status: 400 },
  { label: 'leading zeros', text: '{"value": 007}', status: 400 },
  { label: 'bare word', text: 'hello', status: 400 },
  { label: 'a JSON string at top level', text: '"just a string"', status: 400 },
  { label: 'a JSON number at top level', text: '42', status: 400 },
  { label: 'JSON null at top level', text: 'null', status: 400 },
  { label: 'JSON true at top level', text: 'true', status: 400 },
  { label: 'lone surrogate escape in a key', text: '{"\\ud800": 1', status: 400 },
  { label: 'two objects back to back', text: '{"a":1}{"b":2}', status: 400 },
  { label: 'NUL byte in the middle', text: '{"a":\u00001}', status: 400 },
  { label: 'unbalanced 10,000 open brackets', text: '['.repeat(10_000), status: 400 },
  { label: '1.1 MB string (over the 1 MiB limit)', text: `{"name": ${JSON.stringify('a'.repeat(1_100_000))}}`, status: 413 },
  { label: '550,000 levels of nesting (over 1 MiB)', text: nest('[', ']', 550_000), status: 413 },
];

export interface ShapeBody {
  label: string;
  text: string;
}

export const SHAPE_BODIES: ShapeBody[] = [
  { label: 'empty object', text: '{}' },
  { label: 'an array', text: '[]' },
  { label: 'an array of objects', text: '[{"name":"x"}]' },
  { label: '10,000 levels of objects', text: nest('{"a":', '}', 10_000) },
  { label: '10,000 levels of arrays', text: nest('[', ']', 10_000) },
  { label: '100,000 levels of arrays', text: nest('[', ']', 100_000) },
  { label: '__proto__ only', text: '{"__proto__": {"polluted": "yes"}}' },
  { label: 'constructor.prototype only', text: '{"constructor": {"prototype": {"polluted": "yes"}}}' },
  { label: 'prototype key', text: '{"prototype": {"polluted": "yes"}}' },
  { label: 'a field named "constructor.prototype.polluted"', text: '{"constructor.prototype.polluted": "yes"}' },
  { label: 'a 100,000-element array', text: `[${Array(100_000).fill('0').join(',')}]` },
  { label: 'an object with 50,000 keys', text: `{${Array.from({ length: 50_000 }, (_, k) => `"k${k}":0`).join(',')}}` },
];

export interface HostileValue {
  label: string;
  /** The raw JSON text put in place of the field's value (may be invalid JSON on purpose). */
  raw: string;
  /** True when this value is something the product must refuse in a field with this schema. */
  appliesTo(node: SchemaNode): boolean;
  /** 400 when the body is no longer JSON; otherwise 400 or 422. */
  invalidJson?: boolean;
}

/** The JSON types a field admits, read from type/enum/const/anyOf/oneOf. */
export function admittedTypes(node: SchemaNode): Set<string> {
  const types = new Set<string>();
  const add = (t: string) => {
    types.add(t);
    if (t === 'integer') types.add('number');
  };
  if (node.type) ([] as string[]).concat(node.type).forEach(add);
  for (const v of node.enum ?? []) add(v === null ? 'null' : Array.isArray(v) ? 'array' : typeof v);
  if ('const' in node) add(node.const === null ? 'null' : typeof node.const);
  for (const sub of [...(node.anyOf ?? []), ...(node.oneOf ?? [])]) admittedTypes(sub).forEach(add);
  if (types.size === 0 && node.properties) add('object');
  return types;
}

const admits = (node: SchemaNode, type: string) => admittedTypes(node).has(type);
/** Every alternative that admits `type` (the node itself, or members of anyOf/oneOf). */
const alternatives = (node: SchemaNode, type: string): SchemaNode[] =>
  [node, ...(node.anyOf ?? []), ...(node.oneOf ?? [])].filter((n) => n.type !== undefined && ([] as string[]).concat(n.type).some((t) => t === type || (type === 'number' && t === 'integer')));
/** A string that must match a list, a format or an anchored pattern (so SQL or a path cannot be a valid value). */
const constrained = (node: SchemaNode): boolean => {
  const alts = [...(node.anyOf ?? []), ...(node.oneOf ?? [])];
  if (alts.length > 0) return alts.every((n) => n.type === 'null' || constrained(n));
  return node.enum !== undefined || 'const' in node || node.format !== undefined || (node.pattern !== undefined && node.pattern.startsWith('^') && node.pattern.endsWith('$'));
};
const onlyString = (node: SchemaNode) => admits(node, 'string') && alternatives(node, 'string').length > 0;
const numeric = (node: SchemaNode) => alternatives(node, 'number');
const integerOnly = (node: SchemaNode) => numeric(node).length > 0 && numeric(node).every((n) => n.type === 'integer');

export const HOSTILE_VALUES: HostileValue[] = [
  // Wrong types (each where the field does not admit that type).
  { label: 'a number where it does not belong', raw: '42', appliesTo: (n) => !admits(n, 'number') },
  { label: 'a string where it does not belong', raw: '"text"', appliesTo: (n) => !admits(n, 'string') || (n.enum !== undefined && !n.enum.includes('text')) },
  { label: 'true where it does not belong', raw: 'true', appliesTo: (n) => !admits(n, 'boolean') },
  { label: 'null where it does not belong', raw: 'null', appliesTo: (n) => !admits(n, 'null') },
  { label: 'an object where it does not belong', raw: '{"$gt": ""}', appliesTo: (n) => !admits(n, 'object') },
  { label: 'an array where it does not belong', raw: '["x"]', appliesTo: (n) => !admits(n, 'array') },
  // Numbers.
  { label: 'NaN spelled as a string', raw: '"NaN"', appliesTo: (n) => admits(n, 'number') && !admits(n, 'string') },
  { label: 'Infinity spelled as a string', raw: '"Infinity"', appliesTo: (n) => admits(n, 'number') && !admits(n, 'string') },
  { label: 'a number spelled as a string', raw: '"42"', appliesTo: (n) => admits(n, 'number') && !admits(n, 'string') },
  { label: 'bare NaN token', raw: 'NaN', appliesTo: () => true, invalidJson: true },
  { label: 'bare Infinity token', raw: 'Infinity', appliesTo: () => true, invalidJson: true },
  { label: '1e308', raw: '1e308', appliesTo: (n) => numeric(n).length > 0 && numeric(n).every((a) => a.maximum !== undefined && a.maximum < 1e308) },
  { label: '-1e308', raw: '-1e308', appliesTo: (n) => numeric(n).length > 0 && numeric(n).every((a) => (a.minimum ?? a.exclusiveMinimum) !== undefined) },
  { label: '1e999 (Infinity once parsed)', raw: '1e999', appliesTo: (n) => numeric(n).length > 0 },
  { label: '-1e999 (-Infinity once parsed)', raw: '-1e999', appliesTo: (n) => numeric(n).length > 0 },
  { label: '5e-324 where a whole number is required', raw: '5e-324', appliesTo: (n) => numeric(n).length > 0 && integerOnly(n) },
  { label: 'negative zero where zero is excluded', raw: '-0', appliesTo: (n) => numeric(n).length > 0 && numeric(n).every((a) => a.exclusiveMinimum === 0 || (a.minimum ?? -Infinity) > 0) },
  { label: 'a fraction where a whole number is required', raw: '1.5', appliesTo: integerOnly },
  { label: '2^53 + 1 where a small whole number is required', raw: '9007199254740993', appliesTo: integerOnly },
  // Strings.
  { label: 'a 1 MB string', raw: MB_STRING, appliesTo: (n) => onlyString(n) && alternatives(n, 'string').every((a) => a.maxLength !== undefined || a.format !== undefined || a.pattern !== undefined) || (n.enum !== undefined && n.enum.every((v) => typeof v === 'string')) },
  { label: 'an empty string', raw: '""', appliesTo: (n) => onlyString(n) && alternatives(n, 'string').every((a) => a.format !== undefined || a.pattern !== undefined || (a as { minLength?: number }).minLength === 1) || (n.enum !== undefined && !n.enum.includes('')) },
  { label: 'a NUL character', raw: '"Bench\\u0000Lab"', appliesTo: (n) => admits(n, 'string') },
  { label: 'bell and escape characters', raw: '"\\u0007\\u001b[2J\\u001b[31mred"', appliesTo: (n) => admits(n, 'string') },
  { label: 'a C1 control character (NEL)', raw: '"next\\u0085line"', appliesTo: (n) => admits(n, 'string') },
  { label: 'a lone surrogate (not Unicode)', raw: '"\\ud800x"', appliesTo: (n) => admits(n, 'string') },
  { label: "SQL: ' OR 1=1 --", raw: JSON.stringify("' OR 1=1 --"), appliesTo: (n) => admits(n, 'string') && constrained(n) },
  { label: 'SQL: ; DROP TABLE runs', raw: JSON.stringify("x'; DROP TABLE runs; --"), appliesTo: (n) => admits(n, 'string') && constrained(n) },
  { label: 'path traversal', raw: JSON.stringify('../../etc/passwd'), appliesTo: (n) => admits(n, 'string') && constrained(n) },
  { label: 'a uuid with a trailing character', raw: '"00000000-0000-4000-8000-000000000000x"', appliesTo: (n) => n.format === 'uuid' },
  { label: 'a date that does not exist (2026-02-30)', raw: '"2026-02-30"', appliesTo: (n) => n.format === 'date' },
  { label: 'a date of year 99999', raw: '"99999-01-01"', appliesTo: (n) => n.format === 'date' },
  { label: 'an e-mail with a header injection', raw: '"a@b.example\\r\\nBcc: victim@evil.example"', appliesTo: (n) => alternatives(n, 'string').some((a) => a.format === 'email') },
  // Arrays and objects.
  { label: 'a 10,000-element array', raw: `[${Array(10_000).fill('"x"').join(',')}]`, appliesTo: (n) => admits(n, 'array') && (n.maxItems ?? Infinity) < 10_000 },
  { label: '10,000 levels of arrays', raw: nest('[', ']', 10_000), appliesTo: (n) => admits(n, 'array') || !admits(n, 'object') },
  { label: '10,000 levels of objects', raw: nest('{"a":', '}', 10_000), appliesTo: (n) => !admits(n, 'object') || n.additionalProperties !== undefined },
  { label: 'an object with a __proto__ key', raw: '{"__proto__": {"polluted": "yes"}}', appliesTo: (n) => !admits(n, 'object') || n.additionalProperties !== undefined },
];

export interface BodyMutation {
  /** What was done, e.g. "/ratedPepW = 1e999 (Infinity once parsed)". */
  label: string;
  text: string;
  invalidJson: boolean;
}

const PLACEHOLDER = '"@@HOSTILE@@"';

/** `base` as JSON with the value at `path` replaced by raw text. */
function replaceAt(base: unknown, path: (string | number)[], raw: string): string {
  const copy = structuredClone(base) as Record<string | number, unknown>;
  let target = copy;
  for (const key of path.slice(0, -1)) target = target[key] as Record<string | number, unknown>;
  target[path[path.length - 1]] = '@@HOSTILE@@';
  return JSON.stringify(copy).replace(PLACEHOLDER, () => raw);
}

function withoutKey(base: unknown, path: (string | number)[]): string {
  const copy = structuredClone(base) as Record<string | number, unknown>;
  let target = copy;
  for (const key of path.slice(0, -1)) target = target[key] as Record<string | number, unknown>;
  delete target[path[path.length - 1]];
  return JSON.stringify(copy);
}

/** The object-valued property schemas of `node` reached in `base`, down to `depth` levels. */
function fields(node: SchemaNode, base: unknown, path: (string | number)[], depth: number): { path: (string | number)[]; node: SchemaNode; required: boolean }[] {
  const out: { path: (string | number)[]; node: SchemaNode; required: boolean }[] = [];
  if (typeof base !== 'object' || base === null || depth === 0) return out;
  const objectNode = node.properties ? node : [...(node.oneOf ?? []), ...(node.anyOf ?? [])].find((n) => n.properties);
  if (Array.isArray(base)) {
    const items = Array.isArray(node.items) ? node.items[0] : node.items;
    if (items && base.length > 0) for (const f of fields(items as SchemaNode, base[0], [...path, 0], depth)) out.push(f);
    return out;
  }
  if (!objectNode?.properties) return out;
  for (const [key, child] of Object.entries(objectNode.properties)) {
    if (!(key in (base as Record<string, unknown>))) continue;
    out.push({ path: [...path, key], node: child, required: (objectNode.required ?? []).includes(key) });
    out.push(...fields(child, (base as Record<string, unknown>)[key], [...path, key], depth - 1));
  }
  return out;
}

/**
 * Every hostile variant of a valid body: each applicable HOSTILE_VALUE in each field (down to
 * `depth` levels of nesting), each required field left out, and unknown / polluting keys added.
 * Each variant must be refused by a route whose schema accepts `base`.
 */
export function bodyMutations(schema: SchemaNode, base: Record<string, unknown>, depth = 2): BodyMutation[] {
  const out: BodyMutation[] = [];
  for (const field of fields(schema, base, [], depth)) {
    const pointer = '/' + field.path.join('/');
    for (const value of HOSTILE_VALUES) {
      if (value.appliesTo(field.node)) out.push({ label: `${pointer} = ${value.label}`, text: replaceAt(base, field.path, value.raw), invalidJson: value.invalidJson ?? false });
    }
    if (field.required) out.push({ label: `${pointer} left out`, text: withoutKey(base, field.path), invalidJson: false });
  }
  const asText = JSON.stringify(base);
  const add = (extra: string) => (asText === '{}' ? `{${extra}}` : `{${extra},${asText.slice(1)}`);
  out.push(
    { label: 'an unknown field', text: add('"unknownField": 1'), invalidJson: false },
    { label: 'a __proto__ key', text: add('"__proto__": {"polluted": "yes"}'), invalidJson: false },
    { label: 'a constructor.prototype key', text: add('"constructor": {"prototype": {"polluted": "yes"}}'), invalidJson: false },
    { label: 'an unknown field nested 10,000 levels', text: add(`"deep": ${nest('{"a":', '}', 10_000)}`), invalidJson: false },
    { label: 'a duplicate key whose last value is wrong', text: asText === '{}' ? '{"x":1,"x":2}' : `${asText.slice(0, -1)},${JSON.stringify(Object.keys(base)[0])}: {"$ne": null}}`, invalidJson: false },
  );
  return out;
}
