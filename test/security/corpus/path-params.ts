/**
 * Values put where a route expects an id (a UUID) or a token: malformed ids, SQL, traversal,
 * NUL bytes, very long values, and well-formed ids that name nothing. Each is already
 * percent-encoded for the URL path (raw where the raw form is the attack, e.g. a bad escape).
 */
export const BAD_PATH_IDS: { label: string; segment: string }[] = [
  { label: 'not a uuid', segment: 'not-a-uuid' },
  { label: 'SQL: quote OR 1=1', segment: encodeURIComponent("' OR 1=1 --") },
  { label: 'SQL: stacked DROP TABLE', segment: encodeURIComponent('1; DROP TABLE runs') },
  { label: 'nil uuid (names nothing)', segment: '00000000-0000-0000-0000-000000000000' },
  { label: 'max uuid (names nothing)', segment: 'ffffffff-ffff-ffff-ffff-ffffffffffff' },
  { label: 'uuid with a trailing character', segment: '00000000-0000-4000-8000-000000000000x' },
  { label: 'uuid with a non-hex digit', segment: '00000000-0000-4000-8000-00000000000g' },
  { label: 'uuid without hyphens, too short', segment: '0000000000004000800000000000' },
  { label: 'NUL byte', segment: '%00' },
  { label: 'NUL inside a uuid', segment: '00000000-0000-4000-8000-%0000000000000' },
  { label: 'encoded traversal', segment: '..%2F..%2Fetc%2Fpasswd' },
  { label: 'malformed percent escape', segment: '%E0%A4%A' },
  { label: 'lone percent sign', segment: '%' },
  { label: '10,000 characters', segment: 'a'.repeat(10_000) },
  { label: 'negative number', segment: '-1' },
  { label: 'number 1e999', segment: '1e999' },
  { label: 'NaN', segment: 'NaN' },
  { label: '__proto__', segment: '__proto__' },
  { label: 'constructor', segment: 'constructor' },
  { label: 'emoji', segment: encodeURIComponent('😀') },
  { label: 'control characters', segment: encodeURIComponent('\u0007\u001b[2J') },
  { label: 'JSON object', segment: encodeURIComponent('{"$ne":null}') },
];
