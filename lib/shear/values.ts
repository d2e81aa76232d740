/** Small checks of untrusted values, for reading programs defensively. */
export type PlainObject = Record<string, unknown>;
export const isObject = (value: unknown): value is PlainObject =>
  typeof value === "object" && value !== null && !Array.isArray(value);
export const isPositive = (value: unknown): value is number =>
  typeof value === "number" && Number.isFinite(value) && value > 0;
export const isNonNegative = (value: unknown): value is number =>
  typeof value === "number" && Number.isFinite(value) && value >= 0;
export const isAbsent = (value: unknown): boolean => value === undefined || value === null;
export const positiveOrNull = (value: unknown): number | null => (isPositive(value) ? value : null);
export const numberOrNull = (value: unknown): number | null =>
  typeof value === "number" && Number.isFinite(value) ? value : null;

/** A short description of a value for messages. */
export function describe(value: unknown): string {
  if (typeof value === "string") return `"${value.slice(0, 40)}"`;
  if (value === null) return "null";
  if (typeof value === "number") return String(value);
  return typeof value;
}
