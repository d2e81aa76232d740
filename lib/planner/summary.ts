/**
 * A plan's answer from its sheet patterns: what was placed, what was not and why, and the
 * totals (sheets, utilisation with and without reusable offcuts, strokes, turns).
 */
import type { PlanSetup } from "./candidates";
import { writePattern } from "./program";
import { whyUnplaceable } from "./presentation";
import type { Plan, SheetPattern, Unplaced } from "./types";

/** A plan's answer before the planner adds how it was made and what bounds it. */
export type PlanBody = Omit<Plan, "method" | "methodNote" | "bounds" | "lowerBound" | "provenFewest">;

/** Which blanks some sheet can take at all (within the blade and the backgauge's nearest setting). */
export const placeableBlanks = (setup: PlanSetup): boolean[] =>
  setup.blanks.map((_, index) =>
    setup.presentations.some((way) => way.variants.some((variant) => variant.blank === index)),
  );

/** Pieces asked for per blank (whole, not negative). */
export const quantities = (setup: PlanSetup): number[] =>
  setup.blanks.map((blank) => Math.max(0, Math.floor(blank.quantity)));

/** Extra pieces allowed per blank. */
export const allowances = (setup: PlanSetup): number[] =>
  quantities(setup).map((quantity) => Math.floor((quantity * setup.options.overProductionPct) / 100));

/** Patterns cut alike on the same sheet as one pattern with their repeats added (the first keeps its place). */
export function mergeAlike(patterns: SheetPattern[]): SheetPattern[] {
  const byKey = new Map<string, SheetPattern>();
  for (const pattern of patterns) {
    const key = JSON.stringify([pattern.stock, pattern.rotated, pattern.cuts, pattern.strips]);
    const same = byKey.get(key);
    if (same) same.repeats += pattern.repeats;
    else byKey.set(key, { ...pattern });
  }
  return [...byKey.values()];
}

export function assemblePlan(setup: PlanSetup, unmerged: SheetPattern[], produced: number[]): PlanBody {
  const patterns = mergeAlike(unmerged);
  const { blanks, options } = setup;
  const show = options.show ?? String;
  const quantity = quantities(setup);
  const placeable = placeableBlanks(setup);
  const unplaced: Unplaced[] = [];
  blanks.forEach((blank, index) => {
    if (!placeable[index] && quantity[index] > 0)
      unplaced.push({
        blank: index,
        quantity: quantity[index],
        kind: "unplaceable",
        reason: whyUnplaceable(blank, options),
      });
  });
  quantity.forEach((asked, index) => {
    const short = placeable[index] ? asked - produced[index] : 0;
    if (short <= 0) return;
    // Short of stock, or can the shear not cut even one of it from any sheet (a strip or piece its
    // backgauge cannot reach, with no spare to take off first)?
    const alone = setup.presentations.some((way) =>
      way.variants.some(
        (variant) =>
          variant.blank === index &&
          writePattern(
            { length: way.length, width: way.width },
            options.trim,
            [
              {
                width: variant.width,
                pieces: [{ blank: index, length: variant.length, width: variant.width, turned: variant.turned }],
              },
            ],
            options.mmPerUnit,
            setup.gauge,
          ) !== null,
      ),
    );
    unplaced.push(
      alone
        ? { blank: index, quantity: short, kind: "stock_short", reason: "not enough stock on hand" }
        : {
            blank: index,
            quantity: short,
            kind: "unplaceable",
            reason:
              // longer than the backgauge reaches: only ever what is left of a strip or sheet, and here the spare
              // cannot be cut off within the travel (strokes too short for the nearest setting) unless pieces take it
              Math.max(blanks[index].length, blanks[index].width) > setup.gauge.max
                ? `${show(blanks[index].length)} × ${show(blanks[index].width)} is longer than the backgauge reaches (${show(setup.gauge.max)}), so it can only be what is left of a strip or sheet once everything behind it is cut off, and the spare behind it cannot be cut off in strokes within the backgauge's travel (${show(setup.gauge.min)} to ${show(setup.gauge.max)}); ${produced[index]} could be cut after other pieces took that spare (front gauging is not planned)`
                : `${show(blanks[index].length)} × ${show(blanks[index].width)} cannot be cut from any of the stock sheets within the backgauge's travel`,
          },
    );
  });
  let usedArea = 0;
  let stockArea = 0;
  let reusableArea = 0;
  const reusable = new Map<string, { length: number; width: number; count: number }>();
  for (const pattern of patterns) {
    stockArea += pattern.length * pattern.width * pattern.repeats;
    for (const strip of pattern.strips)
      for (const piece of strip.pieces) usedArea += piece.length * piece.width * pattern.repeats;
    for (const offcut of pattern.offcuts) {
      if (!offcut.reusable) continue;
      reusableArea += offcut.length * offcut.width * pattern.repeats;
      const [long, short] =
        offcut.length >= offcut.width ? [offcut.length, offcut.width] : [offcut.width, offcut.length];
      const entry = reusable.get(`${long}x${short}`) ?? { length: long, width: short, count: 0 };
      entry.count += pattern.repeats;
      reusable.set(`${long}x${short}`, entry);
    }
  }
  return {
    patterns,
    sheetsUsed: patterns.reduce((sum, pattern) => sum + pattern.repeats, 0),
    produced,
    extra: produced.map((count, index) => Math.max(0, count - quantity[index])),
    unplaced,
    unusableStock: setup.unusable,
    utilisation: stockArea ? usedArea / stockArea : 0,
    netUtilisation: stockArea - reusableArea > 0 ? usedArea / (stockArea - reusableArea) : 0,
    reusable: [...reusable.values()].sort((a, b) => b.length * b.width - a.length * a.width),
    strokes: patterns.reduce((sum, pattern) => sum + pattern.strokes * pattern.repeats, 0),
    turns: patterns.reduce((sum, pattern) => sum + pattern.turns * pattern.repeats, 0),
  };
}
