/**
 * Strips for one sheet from what may still be placed: built one at a time by a rule (most
 * blank area per unit of strip width, or most area), or taken from the exact best two-stage
 * pattern (`two-stage.ts`) when no blank can run out on one sheet.
 */
import { fillStrip, fittingFor, type StripTables } from "./knapsack";
import type { Presentation, Variant } from "./presentation";
import type { StripIn } from "./written";
import { bestTwoStagePattern } from "./two-stage";
import { PLAN_WORK_BUDGET } from "./types";

export type StripRule = "density" | "area";

/**
 * May a piece lie in a strip this wide? As wide as the strip, or narrower and trimmed to width by
 * one more cut (unless `exact`): then it is gauged at its width, and its offcut must not be a
 * piece itself (the remnant rule) nor within the tolerance of nothing.
 */
export const fitsStrip = (
  variant: Variant,
  stripWidth: number,
  exact: boolean,
  tolerance: number,
  backgaugeMax: number,
) =>
  variant.width === stripWidth ||
  (!exact &&
    variant.width < stripWidth - tolerance &&
    variant.width <= backgaugeMax &&
    Math.abs(stripWidth - 2 * variant.width) > tolerance);

const toPiece = (variant: Variant) => ({
  blank: variant.blank,
  length: variant.length,
  width: variant.width,
  turned: variant.turned,
});

/**
 * Strips for one sheet given what may still be placed (`cap`), added one at a time by `rule`: the
 * most blank area per unit of strip width, or the most area. `exact` keeps to pieces as wide as
 * their strip (no trimming cut).
 */
export function buildStrips(
  way: Presentation,
  cap: number[],
  rule: StripRule,
  exact: boolean,
  tolerance: number,
  tables: StripTables,
): StripIn[] {
  const want = [...cap];
  const strips: StripIn[] = [];
  let free = way.usableWidth;
  const fitting = (variants: Variant[], width: number) => {
    const out: Variant[] = [];
    for (const variant of variants)
      if (fitsStrip(variant, width, exact, tolerance, way.backgaugeMax)) out.push(variant);
    return out;
  };
  for (;;) {
    const open = way.variants.filter((variant) => variant.width <= free && want[variant.blank] > 0);
    const setKey = `${way.stock}${way.rotated ? "r" : ""}${exact ? "e" : "t"}|${want.map((n) => (n > 0 ? 1 : 0)).join("")}`;
    const widths = [...new Set(open.map((variant) => variant.width))].filter((width) => width <= way.maxStripWidth);
    let best: { width: number; pieces: Variant[]; area: number } | null = null;
    for (const width of widths) {
      // What fits a width depends only on the blanks still wanted (`setKey`), not on the width left: kept.
      const fits = fittingFor(tables, setKey, width, () => fitting(open, width));
      const pieces = fillStrip(way.length, width, fits, () => fitting(way.variants, width), want, tables, setKey);
      const area = pieces.reduce((sum, variant) => sum + variant.length * variant.width, 0);
      const better = !best || (rule === "density" ? area / width > best.area / best.width : area > best.area);
      if (area > 0 && better) best = { width, pieces, area };
    }
    if (!best) break;
    strips.push({ width: best.width, pieces: best.pieces.map(toPiece) });
    for (const variant of best.pieces) want[variant.blank] -= 1;
    free -= best.width;
  }
  return strips;
}

/**
 * The best two-stage pattern for one sheet by exact dynamic programming (`two-stage.ts`), when
 * what may still be placed is too much for one sheet to run out of any blank: then the
 * unbounded optimum is also the best capped one. Null when a blank could run out.
 */
export function exactPattern(way: Presentation, cap: number[], tables: StripTables): StripIn[] | null {
  const open = way.variants.filter((variant) => cap[variant.blank] > 0);
  if (!open.length) return null;
  const sheetArea = way.length * way.usableWidth;
  if (open.some((variant) => cap[variant.blank] < Math.floor(sheetArea / (variant.length * variant.width))))
    return null;
  const work =
    new Set(open.map((variant) => variant.width)).size * way.length * open.length + way.usableWidth * open.length;
  if (tables.work + work > PLAN_WORK_BUDGET) return null;
  tables.work += work;
  const best = bestTwoStagePattern(
    { length: way.length, width: way.usableWidth },
    open.map((variant) => ({ length: variant.length, width: variant.width })),
    "length",
  );
  const strips: StripIn[] = [];
  for (const strip of best.strips
    .filter((candidate) => candidate.width <= way.maxStripWidth)
    .sort((a, b) => b.width - a.width)) {
    const pieces = strip.pieces.flatMap((entry) =>
      Array.from({ length: entry.count }, () => toPiece(open[entry.index])),
    );
    for (let copy = 0; copy < strip.count; copy++)
      strips.push({ width: strip.width, pieces: pieces.map((piece) => ({ ...piece })) });
  }
  return strips.length ? strips : null;
}
