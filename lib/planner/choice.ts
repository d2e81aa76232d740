/**
 * Which of two plans for the same order the objective prefers, and the lower bounds a plan
 * can state about itself. Every plan first places as much of what was asked as it can.
 */
import type { PlanSetup } from "./candidates";
import { quantities } from "./summary";
import type { PlanBody } from "./summary";
import { STROKES_UTILISATION_SLACK, type SheetPattern } from "./types";

const stockArea = (plan: PlanBody) =>
  plan.patterns.reduce((sum, pattern) => sum + pattern.length * pattern.width * pattern.repeats, 0);

/** Blank area placed, counting no piece beyond the quantity asked. */
export function placedArea(setup: PlanSetup, produced: number[]): number {
  const quantity = quantities(setup);
  return setup.blanks.reduce(
    (sum, blank, index) => sum + blank.length * blank.width * Math.min(produced[index], quantity[index]),
    0,
  );
}

const blankArea = (plan: PlanBody) =>
  plan.patterns.reduce(
    (sum, pattern) =>
      sum +
      pattern.repeats *
        pattern.strips.reduce(
          (strips, strip) => strips + strip.pieces.reduce((pieces, piece) => pieces + piece.length * piece.width, 0),
          0,
        ),
    0,
  );

const reusableArea = (patterns: SheetPattern[]) =>
  patterns.reduce(
    (sum, pattern) =>
      sum +
      pattern.repeats *
        pattern.offcuts.reduce((offcuts, offcut) => offcuts + (offcut.reusable ? offcut.length * offcut.width : 0), 0),
    0,
  );

/**
 * True when the objective prefers `challenger` to `holder` (ties keep the holder). `fewest_sheets`:
 * fewer sheets, then less stock area; `least_waste`: less stock area not in blanks (nor in kept
 * offcuts, when they count as stock), then fewer sheets; `fewest_strokes`: among plans within
 * the slack of the fuller's utilisation, fewer strokes and turns per blank, then fewer sheets.
 */
export function prefers(setup: PlanSetup, challenger: PlanBody, holder: PlanBody): boolean {
  const placed = placedArea(setup, challenger.produced) - placedArea(setup, holder.produced);
  if (placed !== 0) return placed > 0;
  const { objective, offcutsAsStock } = setup.options;
  const sheets = challenger.sheetsUsed - holder.sheetsUsed;
  const area = stockArea(challenger) - stockArea(holder);
  const waste = (plan: PlanBody) =>
    stockArea(plan) - blankArea(plan) - (offcutsAsStock ? reusableArea(plan.patterns) : 0);
  const fill = (plan: PlanBody) =>
    stockArea(plan) ? (blankArea(plan) + (offcutsAsStock ? reusableArea(plan.patterns) : 0)) / stockArea(plan) : 0;
  const pieces = (plan: PlanBody) => plan.produced.reduce((sum, count) => sum + count, 0) || 1;
  const handling = (plan: PlanBody) => (plan.strokes + plan.turns) / pieces(plan);
  switch (objective) {
    case "least_waste": {
      const difference = waste(challenger) - waste(holder);
      return difference !== 0 ? difference < 0 : sheets < 0;
    }
    case "fewest_strokes": {
      const top = Math.max(fill(challenger), fill(holder));
      const near = (plan: PlanBody) => fill(plan) >= top - STROKES_UTILISATION_SLACK;
      if (near(challenger) !== near(holder)) return near(challenger);
      const difference = handling(challenger) - handling(holder);
      return Math.abs(difference) > 1e-12 ? difference < 0 : sheets < 0;
    }
    default:
      return sheets !== 0 ? sheets < 0 : area < 0;
  }
}

/** Sheets any plan needs for this much blank area: on the largest usable sheet on hand, no fewer. */
export function areaBound(setup: PlanSetup, area: number): number {
  const largest = Math.max(
    0,
    ...setup.presentations
      .filter((way) => setup.stock[way.stock].count !== 0)
      .map((way) => way.length * way.usableWidth),
  );
  return largest > 0 ? Math.ceil(area / largest) : 0;
}
