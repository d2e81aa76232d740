/**
 * Pricing a sheet for column generation: the most a two-stage pattern is worth at given piece
 * values, against the two-stage values listed beside the gcut instances and against exhaustive
 * enumeration of every pattern that keeps the caps; with multipliers on the caps (an LP solved
 * by HiGHS proposes them) the bound stays a bound.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { PricingMemory, priceWithCaps } from "../../lib/planner/capped-pricing";
import { loadLpSolver } from "../../lib/planner/lp-solver";
import type { Presentation } from "../../lib/planner/presentation";
import { priceSheet } from "../../lib/planner/pricing";
import { bestPattern, type Piece } from "./brute-force";
import { gcut, TABLE } from "./gcut";

/** A sheet as the planner presents it, with no shear limits: strips run along `length`. */
const presentation = (sheet: { length: number; width: number }, pieces: Piece[]): Presentation => ({
  stock: 0,
  rotated: false,
  length: sheet.length,
  width: sheet.width,
  usableWidth: sheet.width,
  variants: pieces.map((piece) => ({ blank: piece.blank, length: piece.length, width: piece.width, turned: false })),
  maxStripWidth: sheet.width,
  backgaugeMax: Infinity,
});

const TOLERANCE = 0.1; // the shear core's remnant tolerance on a 1 mm grid

/** Pieces per blank in strips, and whether every piece lies in its strip within the sheet. */
function check(
  strips: { width: number; pieces: { blank: number; length: number; width: number }[] }[],
  sheet: { length: number; width: number },
  caps: number[],
) {
  const counts = caps.map(() => 0);
  expect(strips.reduce((sum, strip) => sum + strip.width, 0)).toBeLessThanOrEqual(sheet.width);
  for (const strip of strips) {
    expect(strip.pieces.reduce((sum, piece) => sum + piece.length, 0)).toBeLessThanOrEqual(sheet.length);
    for (const piece of strip.pieces) {
      expect(piece.width).toBeLessThanOrEqual(strip.width);
      counts[piece.blank] += 1;
    }
  }
  counts.forEach((count, blank) => expect(count).toBeLessThanOrEqual(caps[blank]));
}

describe("pricing a sheet", () => {
  it.each(TABLE)(
    "gcut%d with piece values and no caps: the two-stage values listed beside the data, both ways (%d, %d)",
    (n, alongLength, alongWidth) => {
      const { sheet, pieces } = gcut(n);
      const asPieces = (turn: boolean): Piece[] =>
        pieces.map((piece, blank) => ({
          blank,
          length: turn ? piece.width : piece.length,
          width: turn ? piece.length : piece.width,
          value: piece.value ?? 0,
        }));
      const caps = pieces.map(() => 1e9);
      for (const [turn, target] of [
        [false, alongLength],
        [true, alongWidth],
      ] as const) {
        const shown = turn ? { length: sheet.width, width: sheet.length } : sheet;
        const priced = priceSheet(
          presentation(shown, asPieces(turn)),
          pieces.map((piece) => piece.value ?? 0),
          caps,
          TOLERANCE,
        );
        expect(priced.bound).toBe(target); // the relaxation is exact without caps
        expect(priced.value).toBe(target); // and the pattern it builds reaches it
        check(priced.strips, shown, caps);
      }
    },
  );

  const instance = fc.record({
    sheet: fc.record({ length: fc.integer({ min: 6, max: 18 }), width: fc.integer({ min: 6, max: 14 }) }),
    pieces: fc.array(
      fc.record({
        length: fc.integer({ min: 3, max: 12 }),
        width: fc.integer({ min: 2, max: 10 }),
        value: fc.integer({ min: 1, max: 20 }),
        cap: fc.integer({ min: 1, max: 4 }),
      }),
      { minLength: 1, maxLength: 4 },
    ),
  });

  it("never bounds below the best pattern that keeps the caps, and offers one that keeps them (exhaustive enumeration, property)", () => {
    fc.assert(
      fc.property(instance, ({ sheet, pieces }) => {
        const typed: Piece[] = pieces.map((piece, blank) => ({
          blank,
          length: piece.length,
          width: piece.width,
          value: piece.value,
        }));
        const caps = pieces.map((piece) => piece.cap);
        const best = bestPattern(typed, sheet, caps);
        const priced = priceSheet(
          presentation(sheet, typed),
          typed.map((piece) => piece.value),
          caps,
          TOLERANCE,
        );
        expect(priced.bound).toBeGreaterThanOrEqual(best - 1e-9);
        expect(priced.value).toBeLessThanOrEqual(best + 1e-9);
        check(priced.strips, sheet, caps);
      }),
      { numRuns: 200, seed: 3 },
    );
  });

  it("with multipliers on the caps: still a bound, nearer the best, and a pattern within the caps (exhaustive enumeration, property)", async () => {
    const solver = await loadLpSolver();
    await fc.assert(
      fc.asyncProperty(instance, async ({ sheet, pieces }) => {
        const typed: Piece[] = pieces.map((piece, blank) => ({
          blank,
          length: piece.length,
          width: piece.width,
          value: piece.value,
        }));
        const caps = pieces.map((piece) => piece.cap);
        const values = typed.map((piece) => piece.value);
        const best = bestPattern(typed, sheet, caps);
        const memory = new PricingMemory(solver, typed.length);
        try {
          const priced = priceWithCaps(presentation(sheet, typed), values, caps, TOLERANCE, Infinity, memory, 20);
          const plain = priceSheet(presentation(sheet, typed), values, caps, TOLERANCE);
          expect(priced.bound).toBeGreaterThanOrEqual(best - 1e-6);
          expect(priced.bound).toBeLessThanOrEqual(plain.bound + 1e-9);
          expect(priced.value).toBeLessThanOrEqual(best + 1e-9);
          check(priced.strips, sheet, caps);
        } finally {
          memory.dispose();
        }
      }),
      { numRuns: 60, seed: 5 },
    );
  });
});
