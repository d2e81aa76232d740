/**
 * A whole plan by column generation: the LP over all sheets together (`column-generation.ts`)
 * gives the lower bound and a fractional plan; whole sheets are then fixed from it (every
 * pattern the LP cuts at least once, as often as it does; when none, the one it cuts most,
 * once), and the LP is solved again for what is left, with new patterns priced for it, until
 * nothing is left. So the last sheets are planned together for the pieces that remain, not
 * filled one after another. What the LP cannot place (stock running short, a budget spent) is
 * placed pattern by pattern (`greedy.ts`). When that plan is not provably the fewest sheets,
 * whole sheets over every pattern found are tried as a small integer program
 * (`whole-sheets.ts`). Deterministic: the same order gives the same plan.
 */
import { toSheetPattern, writeCandidate, type Candidate, type PlanSetup } from "./candidates";
import {
  disposeGeneration,
  generate,
  LP_EPSILON,
  newGeneration,
  restrict,
  type Generation,
  type Residual,
} from "./column-generation";
import { planGreedy } from "./greedy";
import type { LpSolver } from "./lp-solver";
import { Master, type MasterSolution } from "./master";
import { priceSheet } from "./pricing";
import { fewerWholeSheets, withoutSurplus, type SheetUse } from "./whole-sheets";
import type { SheetPattern } from "./types";

/** Share of the budget the first LP may take; whole sheets are fixed from it (converged or not) with the rest. */
const ROOT_SHARE = 0.6;
/** Patterns offered to the whole-sheet program: at most this many, each within this reduced cost (sheets) of paying its way. */
const WHOLE_SHEET_COLUMNS = 800;
const WHOLE_SHEET_REDUCED_COST = 1;

export interface ColumnGenerationPlan {
  /** the Lagrangian lower bound on sheets for placing everything wanted (fractional; 0 when none was found) */
  bound: number;
  /** the LP optimum over the patterns found (sheets, fractional) */
  lp: number;
  /** the plan from the LP; null when the bound already proves the known plan the fewest sheets */
  plan: { patterns: SheetPattern[]; produced: number[]; repairedSheets: number } | null;
  /** the work budget ran out: before the first LP was optimal, or while whole sheets were being fixed (the rest was placed pattern by pattern) */
  budgetSpent: boolean;
  work: number;
}

/** Told the patterns so far and the pieces they make per blank, after each sheet pattern is chosen. */
export type PatternReport = (patterns: number, produced: number[]) => void;

/** A plan already made (by the greedy): its sheets, and its patterns to start the LP with. */
export interface KnownPlan {
  sheets: number;
  candidates: Candidate[];
}

/**
 * Plan `wanted` pieces per blank (with up to `allowance` more) on the sheets `onHand`. Null when
 * the LP fails to solve (the caller keeps the greedy plan).
 */
export function planByColumnGeneration(
  setup: PlanSetup,
  solver: LpSolver,
  residual: Residual,
  budget: number,
  known: KnownPlan | null,
  report?: PatternReport,
): ColumnGenerationPlan | null {
  const master = new Master(solver, setup.blanks.length, residual.wanted, residual.onHand);
  const generation = newGeneration(setup, solver, master, budget * ROOT_SHARE);
  try {
    seed(generation, residual, known?.candidates ?? []);
    const root = generate(generation, residual, {
      known: known?.sheets,
      maxRounds: Infinity,
      quickSteps: 1,
      deepSteps: 10,
    });
    if (!root.solution) return null;
    const result = {
      bound: root.bound,
      lp: root.solution.objective,
      budgetSpent: root.status === "budget",
      work: generation.work,
    };
    if (known && Math.ceil(root.bound - LP_EPSILON) >= known.sheets) return { ...result, plan: null };
    generation.budget = budget; // the rest is for whole sheets
    const left: Residual = {
      wanted: [...residual.wanted],
      allowance: [...residual.allowance],
      onHand: [...residual.onHand],
    };
    const produced = residual.wanted.map(() => 0);
    const repeats = new Map<number, number>(); // column → sheets, in the order first fixed
    let solution = root.solution;
    while (left.wanted.some((count) => count > 0)) {
      if (!fixSheets(master.columns, solution.primal, left, produced, repeats)) break;
      report?.(repeats.size, produced);
      if (!left.wanted.some((count) => count > 0)) break;
      if (generation.work > budget) {
        result.budgetSpent = true;
        break;
      }
      restrict(generation, left);
      const next = generate(generation, left, { maxRounds: 20, quickSteps: 1, deepSteps: 6 });
      if (!next.solution) break;
      solution = next.solution;
    }
    let uses: SheetUse[] = [...repeats].map(([column, count]) => ({
      candidate: master.columns[column].candidate,
      count,
    }));
    let repair = repairRest(setup, { ...left, onHand: residual.onHand }, uses);
    // Not provably the fewest: whole sheets over every pattern found may do with fewer.
    const sheets = (plan: SheetUse[]) => plan.reduce((sum, use) => sum + use.count, 0);
    if (sheets(repair.uses) > Math.ceil(root.bound - LP_EPSILON) && generation.work <= budget) {
      const columns = new Set([
        ...promising(master.columns, root.solution),
        ...repair.uses.map((use) => use.candidate),
      ]);
      const fewer = fewerWholeSheets(
        solver,
        [...columns],
        residual,
        repair.uses,
        (cells) => (generation.work += cells),
      );
      if (fewer) {
        const trimmed = withoutSurplus(setup, fewer, residual);
        const rest: Residual = {
          wanted: residual.wanted.map((count, blank) => Math.max(0, count - trimmed.produced[blank])),
          allowance: residual.allowance.map(
            (count, blank) => count - Math.max(0, trimmed.produced[blank] - residual.wanted[blank]),
          ),
          onHand: residual.onHand,
        };
        const fewerRepair = repairRest(setup, rest, trimmed.uses);
        if (sheets(fewerRepair.uses) < sheets(repair.uses)) {
          uses = trimmed.uses;
          repair = fewerRepair;
        }
      }
    }
    const patterns = repair.uses.map((use) => toSheetPattern(use.candidate, use.count));
    const made = residual.wanted.map(() => 0);
    for (const use of repair.uses) for (const [blank, count] of use.candidate.uses) made[blank] += count * use.count;
    report?.(patterns.length, made);
    return {
      ...result,
      work: generation.work + repair.work,
      plan: { patterns, produced: made, repairedSheets: sheets(repair.uses) - sheets(uses) },
    };
  } finally {
    disposeGeneration(generation);
  }
}

/**
 * Place what `left` still wants, pattern by pattern, on what `left.onHand` leaves after the
 * sheets `fixed`: all sheets as uses, and the work the greedy spent.
 */
function repairRest(setup: PlanSetup, left: Residual, fixed: SheetUse[]): { uses: SheetUse[]; work: number } {
  const onHand = [...left.onHand];
  for (const use of fixed) {
    const count = onHand[use.candidate.way.stock];
    if (count !== null) onHand[use.candidate.way.stock] = Math.max(0, count - use.count);
  }
  const greedy = planGreedy(setup, left.wanted, left.allowance, onHand);
  return {
    uses: [
      ...fixed,
      ...greedy.chosen.map((candidate, index) => ({ candidate, count: greedy.patterns[index].repeats })),
    ],
    work: greedy.work,
  };
}

/** The patterns nearest to paying their way at the first LP's prices (reduced cost), the best `WHOLE_SHEET_COLUMNS`. */
function promising(columns: Master["columns"], solution: MasterSolution): Candidate[] {
  const reducedCost = columns.map((column) => {
    let worth = 0;
    for (const [blank, count] of column.uses) worth += solution.blankPrice[blank] * count;
    return 1 + solution.stockPrice[column.stock] - worth;
  });
  return [...columns.keys()]
    .filter((index) => reducedCost[index] <= WHOLE_SHEET_REDUCED_COST)
    .sort((a, b) => reducedCost[a] - reducedCost[b] || a - b)
    .slice(0, WHOLE_SHEET_COLUMNS)
    .map((index) => columns[index].candidate);
}

/** First columns: the patterns of a plan already known, and on every presented sheet the fullest pattern by area. */
function seed(generation: Generation, residual: Residual, candidates: Candidate[]): void {
  const { setup, master } = generation;
  for (const candidate of candidates) {
    if (!master.has(candidate.way.stock, candidate.uses))
      master.add({ candidate, stock: candidate.way.stock, uses: candidate.uses });
  }
  const caps = residual.wanted.map((count, blank) => count + residual.allowance[blank]);
  const areas = setup.blanks.map((blank, index) => (residual.wanted[index] > 0 ? blank.length * blank.width : 0));
  for (const way of setup.presentations) {
    if (residual.onHand[way.stock] === 0) continue;
    const priced = priceSheet(way, areas, caps, setup.tolerance);
    generation.work += priced.work;
    const candidate = priced.strips.length
      ? writeCandidate(setup, way, priced.strips, (blank) => residual.wanted[blank] > 0)
      : null;
    if (candidate && !master.has(way.stock, candidate.uses))
      master.add({ candidate, stock: way.stock, uses: candidate.uses });
  }
}

/**
 * Fix whole sheets from the LP's plan: every column cut at least once, as often as it is cut
 * (within what is wanted, the allowance and the stock); when none is, the one cut most, once.
 * Updates `left`, `produced` and `repeats`; false when nothing could be fixed.
 */
function fixSheets(
  columns: Master["columns"],
  primal: Float64Array,
  left: Residual,
  produced: number[],
  repeats: Map<number, number>,
): boolean {
  const order = [...primal.keys()]
    .filter((column) => primal[column] > LP_EPSILON)
    .sort((a, b) => primal[b] - primal[a] || a - b);
  const most = (column: number) => {
    const { uses, stock } = columns[column];
    let count = left.onHand[stock] ?? Infinity;
    let useful = false;
    for (const [blank, perSheet] of uses) {
      count = Math.min(count, Math.floor((left.wanted[blank] + left.allowance[blank]) / perSheet));
      if (left.wanted[blank] > 0) useful = true;
    }
    return useful ? count : 0;
  };
  const take = (column: number, count: number) => {
    const { uses, stock } = columns[column];
    for (const [blank, perSheet] of uses) {
      const made = perSheet * count;
      const beyond = Math.max(0, made - left.wanted[blank]);
      left.wanted[blank] = Math.max(0, left.wanted[blank] - made);
      left.allowance[blank] -= beyond;
      produced[blank] += made;
    }
    const onHand = left.onHand[stock];
    if (onHand !== null) left.onHand[stock] = onHand - count;
    repeats.set(column, (repeats.get(column) ?? 0) + count);
  };
  let fixed = false;
  for (const column of order) {
    const whole = Math.floor(primal[column] + LP_EPSILON);
    if (whole < 1) break;
    const count = Math.min(whole, most(column));
    if (count >= 1) {
      take(column, count);
      fixed = true;
    }
  }
  if (fixed) return true;
  const next = order.find((column) => most(column) >= 1);
  if (next === undefined) return false;
  take(next, 1);
  return true;
}
