/**
 * Planning demand onto stock sheets with two-stage patterns a shear can cut: rip strips
 * across the sheet, turn each strip and crosscut it into blanks (a piece narrower than its
 * strip is trimmed to width by a third, turned cut). Every pattern is written as a cut
 * program and run through the shear core's piece flow before it is kept (`program.ts`).
 * Never produces more than asked plus the over-production allowance. Blanks that fit no
 * sheet within the shear's limits are reported, not dropped. Integer dimensions (the
 * caller's grid); no I/O but loading the LP solver once.
 *
 * How: first the greedy plan, pattern by pattern (`greedy.ts`); when the area bound does not
 * already prove it the fewest sheets, column generation over all sheets together
 * (`rounding.ts`), which proves a lower bound and makes a second plan; the objective takes the
 * better. When column generation's work budget runs out first, the greedy plan stands and says so.
 * `fewest_strokes` keeps to the greedy plan (it trades sheets for handling, pattern by pattern).
 *
 * The parts: `types.ts` (inputs and the answer), `presentation.ts` (sheets and blanks as they
 * meet the blade), `knapsack.ts` and `strips.ts` (filling strips and sheets), `candidates.ts`
 * (patterns written, proven and scored), `greedy.ts` (pattern by pattern), `pricing.ts`,
 * `capped-pricing.ts`, `master.ts`, `column-generation.ts` and `rounding.ts` (all sheets
 * together), `choice.ts` (which plan, and its bounds), `summary.ts` (the answer).
 */
import { planSetup } from "./candidates";
import { apartBound, areaBound, placedArea, prefers } from "./choice";
import { LP_EPSILON } from "./column-generation";
import { planGreedy } from "./greedy";
import { loadLpSolver } from "./lp-solver";
import { planByColumnGeneration } from "./rounding";
import { allowances, assemblePlan, placeableBlanks, quantities, type PlanBody } from "./summary";
import {
  PLAN_COLUMN_GENERATION_BUDGET,
  type Blank,
  type Plan,
  type PlanMethod,
  type PlanOptions,
  type PlanProgress,
  type Stock,
} from "./types";

export * from "./types";

export async function planBlanks(stock: Stock[], blanks: Blank[], options: PlanOptions = {}): Promise<Plan> {
  const setup = planSetup(stock, blanks, options);
  const placeable = placeableBlanks(setup);
  const wanted = quantities(setup).map((count, index) => (placeable[index] ? count : 0));
  const piecesWanted = wanted.reduce((sum, count) => sum + count, 0);
  const allowance = allowances(setup);
  const onHand = stock.map((sheet) => sheet.count);
  const progress: { told: PlanProgress | null } = { told: null };
  const report = (patterns: number, produced: number[]) => {
    progress.told = { patterns, piecesPlaced: placedCount(produced), piecesWanted };
    options.onProgress?.(progress.told);
  };
  const placesAll = (produced: number[]) => produced.every((count, index) => count >= wanted[index]);
  const placedCount = (produced: number[]) =>
    produced.reduce((sum, count, index) => sum + Math.min(count, wanted[index]), 0);

  const greedy = planGreedy(setup, wanted, allowance, onHand);
  const greedyPlan = assemblePlan(setup, greedy.patterns, greedy.produced);
  const wantedArea = placedArea(setup, wanted);
  let chosen: PlanBody = greedyPlan;
  let method: PlanMethod = "greedy";
  let methodNote: string | null = null;
  let lpBound: number | null = null;
  const greedyComplete = placesAll(greedy.produced);
  const budget = options.columnGenerationBudget ?? PLAN_COLUMN_GENERATION_BUDGET;
  const apartWanted = apartBound(setup, wanted);
  const proven = greedyComplete && greedyPlan.sheetsUsed <= Math.max(areaBound(setup, wantedArea), apartWanted);
  // Fewest strokes trades sheets for handling pattern by pattern; planning all sheets together serves the other objectives.
  const together = piecesWanted > 0 && !proven && setup.options.objective !== "fewest_strokes";
  if (together && budget <= 0)
    methodNote =
      "No work budget was given for planning all sheets together: this plan was made pattern by pattern, and may use more sheets than needed.";
  if (together && budget > 0) {
    const solver = options.lpSolver ?? (await loadLpSolver());
    const known = greedyComplete ? { sheets: greedyPlan.sheetsUsed, candidates: greedy.chosen } : null;
    const generated = planByColumnGeneration(setup, solver, { wanted, allowance, onHand }, budget, known, report);
    if (generated) {
      lpBound = generated.bound > 0 ? Math.ceil(generated.bound - LP_EPSILON) : null;
      if (generated.plan) {
        const generatedPlan = assemblePlan(setup, generated.plan.patterns, generated.plan.produced);
        if (prefers(setup, generatedPlan, greedyPlan)) {
          chosen = generatedPlan;
          method = "column_generation";
          if (generated.budgetSpent)
            methodNote = `The work budget ran out before the plan for all sheets together was finished; its last ${generated.plan.repairedSheets} sheets were planned pattern by pattern.`;
        } else if (generated.budgetSpent) {
          methodNote =
            "The work budget ran out before all sheets could be planned together: this plan was made pattern by pattern, and may use more sheets than needed.";
        }
      }
    }
  }
  // Reports so far followed the plan for all sheets together as its sheets were fixed. The plan chosen is
  // told pattern by pattern when nothing was told yet, else where it ends.
  const last = progress.told;
  const produced = blanks.map(() => 0);
  chosen.patterns.forEach((pattern, index) => {
    for (const strip of pattern.strips) for (const piece of strip.pieces) produced[piece.blank] += pattern.repeats;
    if (!last) report(index + 1, produced);
  });
  if (last && (last.patterns !== chosen.patterns.length || last.piecesPlaced !== placedCount(produced)))
    report(chosen.patterns.length, produced);
  const complete = placesAll(chosen.produced);
  const area = areaBound(setup, placedArea(setup, chosen.produced));
  // a complete plan places what was wanted, whose bound is known; a partial one is bounded on what it places
  const apart = complete
    ? apartWanted
    : apartBound(
        setup,
        chosen.produced.map((count, index) => Math.min(count, wanted[index])),
      );
  const lowerBound = Math.max(area, apart, complete ? (lpBound ?? 0) : 0);
  return {
    ...chosen,
    method,
    methodNote,
    bounds: { area, apart, lp: complete ? lpBound : null },
    lowerBound,
    provenFewest: chosen.sheetsUsed <= lowerBound,
  };
}

/** The simplest lower bound on sheets: total blank area over one sheet's area (one stock size). */
export function areaLowerBound(sheet: { length: number; width: number }, blanks: Blank[]): number {
  const area = blanks.reduce((sum, blank) => sum + blank.length * blank.width * blank.quantity, 0);
  return Math.ceil(area / (sheet.length * sheet.width));
}
