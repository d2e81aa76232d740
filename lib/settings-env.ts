/**
 * Whole-number settings read from the environment: a value that is not a whole number of 1 or more
 * is refused with a message naming the setting, never silently replaced by the default.
 */
export function wholeNumberSetting(
  env: Record<string, string | undefined>,
  name: string,
  what: string,
  fallback: () => number,
): number {
  const set = env[name];
  if (set === undefined || set.trim() === "") return fallback();
  const value = Number(set);
  if (!Number.isInteger(value) || value < 1)
    throw new Error(`${name} must be a whole number of ${what}, 1 or more (it is "${set}")`);
  return value;
}
