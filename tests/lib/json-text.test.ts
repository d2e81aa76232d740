import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { holdsRememberedJson, jsonBytes, jsonTextAround, rememberJsonBytes } from "../../lib/json-text";

/** What the answer must be: the UTF-8 of JSON.stringify(value). */
const expected = (value: unknown) => {
  const text = JSON.stringify(value);
  return text === undefined ? undefined : Buffer.from(text, "utf8");
};
const remember = <T extends object>(value: T, text: string) => rememberJsonBytes(value, [Buffer.from(text, "utf8")]);

describe("jsonBytes", () => {
  it("is the UTF-8 of JSON.stringify for values with nothing remembered", () => {
    const values: unknown[] = [
      null,
      0,
      -1.5e-7,
      'text with "quotes" and \\ and \u2028, é, √ and 🔧',
      "\uD800 lone",
      true,
      [1, undefined, () => 1, Symbol("s"), null],
      Object.assign(new Array(3), { 0: 1, 2: 3 }), // a hole serialises as null

      { a: undefined, b: () => 1, c: Symbol("s"), d: 1, 'key "q"': [{ deep: { deeper: { deepest: [1, 2] } } }] },
      { when: new Date("2026-12-03T08:00:00Z"), nested: { toJSON: () => "custom" } },
      { gone: { toJSON: () => undefined }, kept: 1 },
      Object.assign(Object.create(null), { bare: 1 }),
      { data: [{ index: 0, program: { id: "prg_1", n: 1.1 } }] },
    ];
    for (const value of values) {
      expect(jsonBytes(value)).toEqual(expected(value));
      if (value !== null && typeof value === "object")
        expect(jsonBytes(holdsRememberedJson(value))).toEqual(expected(value));
    }
    expect(jsonBytes(undefined)).toBeUndefined();
    expect(jsonBytes(() => 1)).toBeUndefined();
    expect(() => rememberJsonBytes({}, [])).toThrow(TypeError);
  });

  it("reuses remembered bytes for the value itself, and within the first levels of a value marked as holding some", () => {
    const program = { id: "prg_1", title: "Längsschnitt – 3 mm", check: { layout: { rectangles: [{ x: 1.25 }] } } };
    const text = JSON.stringify(program);
    // remembered in pieces, split inside a character's bytes: only the whole must be the text's UTF-8
    const whole = Buffer.from(text, "utf8");
    const cut = whole.indexOf(Buffer.from("–")) + 1;
    rememberJsonBytes(program, [whole.subarray(0, cut), whole.subarray(cut)]);
    const bodies = [
      program,
      holdsRememberedJson({ data: [program, program] }),
      holdsRememberedJson({ data: [{ index: 0, status: 201, program }] }),
      holdsRememberedJson({ data: [{ index: 0, status: 422, problem: { detail: "ü" }, skipped: undefined }] }),
      // a remembered value, then keys that write nothing, then one that does
      holdsRememberedJson({ data: [{ program, skipped: undefined, fn: () => 1, last: "é" }], gone: undefined }),
      holdsRememberedJson({ data: Object.assign([program], { toJSON: () => ["own toJSON"] }) }),
    ];
    for (const body of bodies) expect(jsonBytes(body)).toEqual(expected(body));
    // the remembered bytes are what is sent: different bytes show they were used
    const marked = remember({ id: "prg_2" }, '{"id":"prg_2","from":"bytes"}');
    expect(jsonBytes(marked)?.toString()).toBe('{"id":"prg_2","from":"bytes"}');
    expect(jsonBytes(holdsRememberedJson({ data: [marked] }))?.toString()).toBe(
      '{"data":[{"id":"prg_2","from":"bytes"}]}',
    );
    // an answer not marked is serialised as it is, in one JSON.stringify
    expect(jsonBytes({ data: [marked] })?.toString()).toBe('{"data":[{"id":"prg_2"}]}');
  });

  it("gives the UTF-8 of JSON.stringify for any JSON value, with any of its objects remembered (property: fast-check)", () => {
    fc.assert(
      fc.property(fc.jsonValue(), fc.nat(), (value, pick) => {
        const objects: object[] = [];
        const collect = (v: unknown) => {
          if (v !== null && typeof v === "object") {
            objects.push(v);
            Object.values(v).forEach(collect);
          }
        };
        collect(value);
        if (objects.length) {
          const chosen = objects[pick % objects.length];
          remember(chosen, JSON.stringify(chosen));
        }
        expect(jsonBytes(value)).toEqual(expected(value));
        if (value !== null && typeof value === "object")
          expect(jsonBytes(holdsRememberedJson(value))).toEqual(expected(value));
      }),
      { numRuns: 2000, seed: 11 },
    );
  });
});

describe("jsonTextAround", () => {
  it("splits JSON.stringify(value) around one key's value, wherever the key is (property: fast-check)", () => {
    fc.assert(
      fc.property(
        fc.dictionary(
          fc.string().filter((key) => key !== "check"),
          fc.jsonValue(),
        ),
        fc.jsonValue(),
        fc.nat(),
        (rest, inner, at) => {
          // the key's place among the others: first, in between or last (Object.fromEntries keeps "__proto__" as a key)
          const entries = Object.entries(rest);
          entries.splice(at % (entries.length + 1), 0, ["check", inner]);
          const value = Object.fromEntries(entries);
          const parts = jsonTextAround(value, "check");
          expect(parts.inner).toBe(JSON.stringify(value.check));
          expect(parts.head + parts.inner + parts.tail).toBe(JSON.stringify(value));
        },
      ),
      { numRuns: 2000, seed: 17 },
    );
  });

  it("keeps keys JSON orders first (integer-like ones), odd keys and values JSON leaves out", () => {
    const value = { id: "prg_1", check: { n: 1 }, 7: "seven", gone: undefined, when: new Date(0) };
    const parts = jsonTextAround(value, "check");
    expect(parts.head + parts.inner + parts.tail).toBe(JSON.stringify(value));
    const only = { check: [1, 2] };
    expect(jsonTextAround(only, "check")).toEqual({ head: '{"check":', inner: "[1,2]", tail: "}" });
    const proto = JSON.parse('{"__proto__": {"a": 1}, "check": 2}') as Record<string, unknown>;
    const split = jsonTextAround(proto, "check");
    expect(split.head + split.inner + split.tail).toBe(JSON.stringify(proto));
  });

  it("refuses what JSON.stringify would not write as its own keys: an object with toJSON, a class instance", () => {
    expect(() => jsonTextAround({ check: 1, toJSON: () => "other" }, "check")).toThrow(TypeError);
    expect(() =>
      jsonTextAround(
        new (class Held {
          check = 1;
        })() as unknown as Record<string, unknown>,
        "check",
      ),
    ).toThrow(TypeError);
  });

  it("refuses a key with nothing JSON can write", () => {
    expect(() => jsonTextAround({ id: 1 }, "check")).toThrow(TypeError);
    expect(() => jsonTextAround({ check: undefined }, "check")).toThrow(TypeError);
  });
});
