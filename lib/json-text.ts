/**
 * JSON text serialised once. A value that is written to the database as JSON and then sent as
 * the answer (a created program and its check: kilobytes each, hundreds in a batch) can carry
 * the text it was written as, and `stringify` reuses that text where the value is the answer or
 * appears within the first levels of an answer marked with `holdsJsonText` (other answers are
 * one `JSON.stringify`: looking through every answer for remembered values cost more than it
 * saved). The result is exactly `JSON.stringify(value)`; only the work differs. A value must not
 * change after its text is remembered.
 */

const texts = new WeakMap<object, string>();
const holders = new WeakSet<object>();

/** Remember `text` (which must be `JSON.stringify(value)`) as the JSON of `value`; returns `value`. */
export function rememberJsonText<T extends object>(value: T, text: string): T {
  texts.set(value, text);
  return value;
}

/** Mark `value` as holding remembered values within its first levels, for `stringify` to look for; returns `value`. */
export function holdsJsonText<T extends object>(value: T): T {
  holders.add(value);
  return value;
}

/** How deep `stringify` looks for remembered values (an answer's `{ data: [{ program }] }` is three levels). */
const DEPTH = 3;

const plain = (value: object) => {
  const proto = Object.getPrototypeOf(value);
  return (proto === Object.prototype || proto === null) && typeof (value as { toJSON?: unknown }).toJSON !== "function";
};

/**
 * `JSON.stringify(value)`, reusing the remembered text of the value itself or, when it was marked
 * with `holdsJsonText`, of values within its first few levels.
 */
export function stringify(value: unknown): string | undefined {
  if (value === null || typeof value !== "object") return JSON.stringify(value);
  const known = texts.get(value);
  if (known !== undefined) return known;
  return holders.has(value) ? walk(value, DEPTH) : JSON.stringify(value);
}

function walk(value: unknown, depth: number): string | undefined {
  if (value === null || typeof value !== "object") return JSON.stringify(value);
  const known = texts.get(value);
  if (known !== undefined) return known;
  if (depth === 0) return JSON.stringify(value);
  if (Array.isArray(value)) {
    // as JSON.stringify: items that serialise to nothing (undefined, functions, symbols) become null
    const items: string[] = [];
    for (let i = 0; i < value.length; i++) items.push(walk(value[i], depth - 1) ?? "null");
    return `[${items.join(",")}]`;
  }
  if (!plain(value)) return JSON.stringify(value);
  const parts: string[] = [];
  for (const key of Object.keys(value)) {
    const text = walk((value as Record<string, unknown>)[key], depth - 1);
    if (text !== undefined) parts.push(`${JSON.stringify(key)}:${text}`);
  }
  return `{${parts.join(",")}}`;
}
