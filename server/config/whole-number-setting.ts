/**
 * A whole-number setting from the environment: `fallback` when unset or empty, otherwise the
 * number, refused at start-up (with the variable's name) when it is not a safe integer within
 * `min` .. `max`.
 *
 * @example wholeNumberSetting({ PORT: '8080' }, 'PORT', 4610, { min: 0 }) // 8080
 */
export function wholeNumberSetting(env: NodeJS.ProcessEnv, name: string, fallback: number, range: { min: number; max?: number }): number {
  const raw = env[name];
  if (raw === undefined || raw === '') return fallback;
  const value = Number(raw);
  const { min, max = Number.MAX_SAFE_INTEGER } = range;
  if (!Number.isSafeInteger(value) || value < min || value > max) {
    const bounds = range.max !== undefined ? ` from ${min} to ${max}` : min === 1 ? ' above 0' : min === 0 ? '' : ` of at least ${min}`;
    throw new Error(`config: ${name} must be a whole number${bounds}, got "${raw}"`);
  }
  return value;
}
