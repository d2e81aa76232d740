import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { findUnsafeText, textProblem } from "../../lib/text";
import { plainJsonText } from "../../lib/api/route-input";

describe("text that cannot be stored", () => {
  it("agrees with the language's own check of well-formed UTF-16 (String.prototype.isWellFormed) on any string", () => {
    // fast-check's "binary" strings include lone surrogates; isWellFormed is the ECMAScript reference.
    fc.assert(
      fc.property(fc.string({ unit: "binary", maxLength: 40 }), (s) => {
        const clean = s.replaceAll("\u0000", "");
        expect(textProblem(clean) === null).toBe(clean.isWellFormed());
      }),
      { numRuns: 2000, seed: 7 },
    );
  });

  it("refuses NUL anywhere and names it", () => {
    expect(textProblem("a\u0000b")).toMatch(/NUL character \(U\+0000\)/);
    expect(textProblem("plain text, ünïcödé and 🙂")).toBeNull();
  });

  it("points at the first bad value or key, however deep, without recursion", () => {
    expect(findUnsafeText({ a: ["ok", { b: "x\ud800" }] })).toEqual({
      pointer: "/a/1/b",
      message: expect.stringMatching(/unpaired UTF-16 surrogate/),
    });
    expect(findUnsafeText({ "k/\u0000": 1 })?.pointer).toBe("/k~1\u0000");
    expect(findUnsafeText({ a: 1, b: "fine" })).toBeNull();
    let deep: unknown = "\u0000";
    for (let i = 0; i < 200_000; i++) deep = [deep];
    expect(findUnsafeText(deep)?.pointer.split("/").length).toBe(200_001);
  });

  it("needs no walk over a JSON body whose text has no \\u escape (the route wrapper's shortcut)", () => {
    fc.assert(
      fc.property(fc.jsonValue(), fc.string({ unit: "binary", maxLength: 8 }), (value, extra) => {
        const body = { value, extra, [extra]: 1 };
        const text = JSON.stringify(body);
        if (plainJsonText(text)) expect(findUnsafeText(JSON.parse(text))).toBeNull();
        if (findUnsafeText(body) !== null) expect(plainJsonText(text)).toBe(false);
      }),
      { numRuns: 3000, seed: 5 },
    );
    expect(plainJsonText('{"a":"\\u0000"}')).toBe(false);
    expect(plainJsonText('{"a":"plain ünïcödé 🙂"}')).toBe(true);
  });
});
