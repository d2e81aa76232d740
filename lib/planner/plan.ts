/**
 * Planning demand onto stock sheets with two-stage patterns a shear can cut: rip strips
 * across the sheet, turn each strip and crosscut it into blanks (a piece narrower than its
 * strip is trimmed to width by a third, turned cut). Every pattern is written as a cut
 * program and run through the shear core's piece flow before it is kept (`program.ts`).
 * Never produces more than asked plus the over-production allowance. Blanks that fit no
 * sheet within the shear's limits are reported, not dropped. Pure: no I/O; integer
 * dimensions (the caller's grid).
 *
 * The parts: `types.ts` (inputs and the answer), `presentation.ts` (sheets and blanks as they
 * meet the blade), `knapsack.ts` and `strips.ts` (filling strips and sheets), `candidates.ts`
 * (patterns written, proven and scored), `greedy.ts` (pattern by pattern), `summary.ts` (the answer).
 */
import { planSetup } from "./candidates";
import { planGreedy } from "./greedy";
import { allowances, assemblePlan, placeableBlanks, quantities } from "./summary";
import type { Blank, Plan, PlanOptions, Stock } from "./types";

export * from "./types";

export function planBlanks(stock: Stock[], blanks: Blank[], options: PlanOptions = {}): Plan {
  const setup = planSetup(stock, blanks, options);
  const placeable = placeableBlanks(setup);
  const quantity = quantities(setup);
  const wanted = quantity.map((count, index) => (placeable[index] ? count : 0));
  const piecesWanted = wanted.reduce((sum, count) => sum + count, 0);
  let patterns = 0;
  const placed = blanks.map(() => 0);
  const greedy = planGreedy(setup, wanted, allowances(setup), stock.map((sheet) => sheet.count), (pattern) => {
    patterns += 1;
    for (const strip of pattern.strips) for (const piece of strip.pieces) placed[piece.blank] += pattern.repeats;
    options.onProgress?.({ patterns, piecesPlaced: placed.reduce((sum, count, index) => sum + Math.min(count, wanted[index]), 0), piecesWanted });
  });
  return assemblePlan(setup, greedy.patterns, greedy.produced);
}

/** The simplest lower bound on sheets: total blank area over one sheet's area (one stock size). */
export function areaLowerBound(sheet: { length: number; width: number }, blanks: Blank[]): number {
  const area = blanks.reduce((sum, blank) => sum + blank.length * blank.width * blank.quantity, 0);
  return Math.ceil(area / (sheet.length * sheet.width));
}
