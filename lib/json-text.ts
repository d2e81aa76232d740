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

/** `JSON.stringify(value)` in three parts around the value of one of its keys: `head + inner + tail` is the whole. */
export interface JsonTextAround {
  head: string;
  inner: string;
  tail: string;
}

/**
 * Serialise a plain object around one of its keys, so that the key's value (a program's check,
 * most of its size) can be written and stored on its own while the whole is built from the same
 * text: `head + inner + tail === JSON.stringify(value)`. The key must hold a value JSON can write.
 */
export function jsonTextAround(value: Record<string, unknown>, key: string): JsonTextAround {
  if (!plain(value)) throw new TypeError("only a plain object can be split around a key");
  const inner = JSON.stringify(value[key]);
  if (inner === undefined || !Object.hasOwn(value, key)) throw new TypeError(`no JSON value under "${key}"`);
  // own objects without a prototype, so that any key (even "__proto__") is copied as a plain property
  const before: Record<string, unknown> = Object.create(null);
  const after: Record<string, unknown> = Object.create(null);
  let seen = false;
  for (const k of Object.keys(value)) {
    if (k === key) seen = true;
    else (seen ? after : before)[k] = value[k];
  }
  const first = JSON.stringify(before).slice(1, -1);
  const rest = JSON.stringify(after).slice(1, -1);
  return {
    head: `{${first}${first ? "," : ""}${JSON.stringify(key)}:`,
    inner,
    tail: `${rest ? "," : ""}${rest}}`,
  };
}
