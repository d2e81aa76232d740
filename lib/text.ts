/**
 * Text that cannot be stored: a NUL character (U+0000, which PostgreSQL refuses in text and
 * JSON alike) or a lone UTF-16 surrogate (broken Unicode, which JSON columns refuse). One
 * rule for every way text comes in: the API's route wrapper and the console's action wrapper
 * both ask `findUnsafeText` before anything reaches a service.
 */

export interface UnsafeText {
  /** JSON pointer to the value (or the key) that holds the bad text */
  pointer: string;
  message: string;
}

const escapePointer = (segment: string | number) => String(segment).replace(/~/g, "~0").replace(/\//g, "~1");

/** A high surrogate not followed by a low one, or a low one not preceded by a high one. */
const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;

/** Why this string cannot be stored, or null when it can. */
export function textProblem(text: string): string | null {
  if (text.includes("\u0000")) return "contains a NUL character (U+0000), which cannot be stored";
  if (LONE_SURROGATE.test(text))
    return "contains an unpaired UTF-16 surrogate (broken Unicode), which cannot be stored";
  return null;
}

/**
 * The first string in `value` (values and object keys, at any depth; walked without recursion,
 * so deep nesting cannot overflow the stack) that cannot be stored, or null.
 */
export function findUnsafeText(value: unknown, base = ""): UnsafeText | null {
  const stack: [unknown, string][] = [[value, base]];
  while (stack.length) {
    const [current, pointer] = stack.pop()!;
    if (typeof current === "string") {
      const problem = textProblem(current);
      if (problem) return { pointer, message: problem };
    } else if (Array.isArray(current)) {
      for (let i = current.length - 1; i >= 0; i--) stack.push([current[i], `${pointer}/${i}`]);
    } else if (current !== null && typeof current === "object") {
      const entries = Object.entries(current);
      for (const [key] of entries) {
        const problem = textProblem(key);
        if (problem) return { pointer: `${pointer}/${escapePointer(key)}`, message: `has a key that ${problem}` };
      }
      for (let i = entries.length - 1; i >= 0; i--)
        stack.push([entries[i][1], `${pointer}/${escapePointer(entries[i][0])}`]);
    }
  }
  return null;
}
