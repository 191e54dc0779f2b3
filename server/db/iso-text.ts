/**
 * A timestamptz column as the text JavaScript's Date#toISOString writes (UTC, milliseconds
 * truncated, Z), built by PostgreSQL: a hot read answers it as it is, with no Date parsed from the
 * row and serialized again for JSON.
 */
export const isoText = (column: string) => `to_char(${column} AT TIME ZONE 'UTC', 'YYYY-MM-DD"T"HH24:MI:SS.MS"Z"')`;
