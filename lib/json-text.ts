/**
 * JSON serialised once, kept as UTF-8 bytes. A value that is written to the database as JSON and
 * then sent as the answer (a created program and its check: kilobytes each, hundreds in a batch)
 * can carry the bytes it was written as, and `jsonBytes` reuses them where the value is the answer
 * or appears within the first levels of an answer marked with `holdsRememberedJson` (other answers
 * are one `JSON.stringify`: looking through every answer for remembered values cost more than it
 * saved). The result is exactly the UTF-8 of `JSON.stringify(value)`; only the work differs. A
 * value must not change after its bytes are remembered.
 *
 * Bytes, not strings: a batch's answer and its statement's parameters are ~1 MB each, and on this
 * runtime joining a hundred remembered strings into one and then encoding it cost ~7–10 ms a batch
 * (large strings are allocated afresh each time, and a check's `–` or `√` makes every string
 * holding it two bytes a character), against ~1 ms to encode each program's pieces once and copy
 * the bytes together (`Buffer.concat`).
 */

/** Pieces of UTF-8 whose concatenation is a value's JSON text. */
export type JsonPieces = readonly Bytes[];
type Bytes = Buffer<ArrayBuffer>;

const remembered = new WeakMap<object, JsonPieces>();
const holders = new WeakSet<object>();

/** Remember `pieces` (whose concatenation must be the UTF-8 of `JSON.stringify(value)`) as the JSON of `value`; returns `value`. */
export function rememberJsonBytes<T extends object>(value: T, pieces: JsonPieces): T {
  if (!pieces.length) throw new TypeError("JSON text is never empty");
  remembered.set(value, pieces);
  return value;
}

/** Mark `value` as holding remembered values within its first levels, for `jsonBytes` to look for; returns `value`. */
export function holdsRememberedJson<T extends object>(value: T): T {
  holders.add(value);
  return value;
}

/** How deep `jsonBytes` looks for remembered values (an answer's `{ data: [{ program }] }` is three levels). */
const DEPTH = 3;

const plain = (value: object) => {
  const proto = Object.getPrototypeOf(value);
  return (proto === Object.prototype || proto === null) && typeof (value as { toJSON?: unknown }).toJSON !== "function";
};

/** Text and byte pieces in order; text is encoded in runs, between the pieces of bytes. */
class Output {
  private readonly parts: Bytes[] = [];
  private text = "";
  add(text: string) {
    this.text += text;
  }
  addBytes(pieces: JsonPieces) {
    if (this.text) this.parts.push(Buffer.from(this.text, "utf8"));
    this.text = "";
    for (const piece of pieces) this.parts.push(piece);
  }
  /** where the output is now, to go back to when a value turns out to write nothing */
  mark(): [number, string] {
    return [this.parts.length, this.text];
  }
  reset([length, text]: [number, string]) {
    this.parts.length = length;
    this.text = text;
  }
  bytes(): Bytes {
    if (this.text) this.parts.push(Buffer.from(this.text, "utf8"));
    this.text = "";
    return this.parts.length === 1 ? this.parts[0] : Buffer.concat(this.parts);
  }
}

/**
 * The UTF-8 bytes of `JSON.stringify(value)` (undefined where that is undefined), reusing the
 * remembered bytes of the value itself or, when it was marked with `holdsRememberedJson`, of values
 * within its first few levels.
 */
export function jsonBytes(value: unknown): Bytes | undefined {
  if (value !== null && typeof value === "object") {
    const known = remembered.get(value);
    if (known !== undefined) return known.length === 1 ? known[0] : Buffer.concat(known);
    if (holders.has(value)) {
      const out = new Output();
      return write(value, DEPTH, out) ? out.bytes() : undefined;
    }
  }
  const text = JSON.stringify(value);
  return text === undefined ? undefined : Buffer.from(text, "utf8");
}

/** Write `value`'s JSON to `out`; false (and nothing written) where JSON.stringify gives undefined. */
function write(value: unknown, depth: number, out: Output): boolean {
  if (value !== null && typeof value === "object") {
    const known = remembered.get(value);
    if (known !== undefined) {
      out.addBytes(known);
      return true;
    }
    if (depth > 0 && Array.isArray(value) && typeof (value as { toJSON?: unknown }).toJSON !== "function") {
      // as JSON.stringify: items that serialise to nothing (undefined, functions, symbols) become null
      out.add("[");
      for (let i = 0; i < value.length; i++) {
        if (i) out.add(",");
        if (!write(value[i], depth - 1, out)) out.add("null");
      }
      out.add("]");
      return true;
    }
    if (depth > 0 && plain(value)) {
      out.add("{");
      let first = true;
      for (const key of Object.keys(value)) {
        const before = out.mark();
        out.add(`${first ? "" : ","}${JSON.stringify(key)}:`);
        if (write((value as Record<string, unknown>)[key], depth - 1, out)) first = false;
        else out.reset(before);
      }
      out.add("}");
      return true;
    }
  }
  const text = JSON.stringify(value);
  if (text === undefined) return false;
  out.add(text);
  return true;
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
