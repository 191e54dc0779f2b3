/**
 * Argument checks shared by the measurement engine. The policy for the whole engine: a value of
 * the wrong type throws a TypeError and a value outside the valid domain throws a RangeError, and
 * every message starts with the public function's name so a report or log shows where it arose.
 */

function describe(value: unknown): string {
  return typeof value === 'number' ? String(value) : typeof value;
}

/** Throws a TypeError unless `value` is a number (NaN and ±Infinity pass this check). */
export function requireNumber(fnName: string, name: string, value: unknown): number {
  if (typeof value !== 'number') {
    throw new TypeError(`${fnName}: ${name} must be a number, got ${describe(value)}`);
  }
  return value;
}

/** Returns `value` if it is a finite number; otherwise throws (TypeError / RangeError). */
export function requireFinite(fnName: string, name: string, value: unknown): number {
  const n = requireNumber(fnName, name, value);
  if (!Number.isFinite(n)) {
    throw new RangeError(`${fnName}: ${name} must be finite, got ${n}`);
  }
  return n;
}

/** Returns `value` if it is finite and > 0; otherwise throws. */
export function requirePositive(fnName: string, name: string, value: unknown): number {
  const n = requireFinite(fnName, name, value);
  if (!(n > 0)) {
    throw new RangeError(`${fnName}: ${name} must be greater than 0, got ${n}`);
  }
  return n;
}

/** Returns `value` if it is finite and >= 0; otherwise throws. */
export function requireNonNegative(fnName: string, name: string, value: unknown): number {
  const n = requireFinite(fnName, name, value);
  if (!(n >= 0)) {
    throw new RangeError(`${fnName}: ${name} must be 0 or more, got ${n}`);
  }
  return n;
}

/**
 * Returns a level in dB if it is a number below +Infinity. -Infinity is accepted because it is
 * the exact dB value of zero power; NaN and +Infinity are rejected.
 */
export function requireLevelDb(fnName: string, name: string, value: unknown): number {
  const n = requireNumber(fnName, name, value);
  if (!(n < Infinity)) {
    throw new RangeError(`${fnName}: ${name} must be a level below +Infinity dB, got ${n}`);
  }
  return n;
}

/** Throws a TypeError unless `value` is an array or typed array (only its length is checked). */
export function requireArrayLike(
  fnName: string,
  name: string,
  value: unknown,
): ArrayLike<number> {
  if (
    value === null ||
    typeof value !== 'object' ||
    typeof (value as { length?: unknown }).length !== 'number'
  ) {
    throw new TypeError(`${fnName}: ${name} must be an array of numbers`);
  }
  return value as ArrayLike<number>;
}
