/**
 * Column generation over two-stage patterns (after Gilmore and Gomory): solve the master LP
 * over the patterns found so far, price every presented sheet with the LP's duals as piece
 * values (`pricing.ts`), add each pattern that would lower the LP (written and proven as a
 * cut program first, so every column can be cut as it stands), and repeat until none would.
 *
 * Every round also yields a lower bound on the sheets of any plan that places all the pieces
 * (a Lagrangian bound: for prices y ≥ 0 and V_s the most any pattern on stock s is worth at
 * those prices, θ·Σ demand·y + Σ over counted stock of count·min(0, 1 − θ·V_s), with
 * θ = min(1, 1 / V_s over stock sizes without a count)); it equals the LP optimum once no
 * pattern prices out. Work is counted in table cells and LP iterations.
 */
import { PricingMemory, priceWithCaps } from "./capped-pricing";
import { writeCandidate, type PlanSetup } from "./candidates";
import type { LpSolver } from "./lp-solver";
import type { Master, MasterSolution } from "./master";
import type { StripIn } from "./written";

/** Numerical slack for reduced costs and for rounding a bound up. */
export const LP_EPSILON = 1e-6;
/** How far pricing leans toward the prices with the best bound so far (dual smoothing): steadier columns, fewer rounds. */
const SMOOTHING = 0.7;
/** The gap between the LP and the bound must close by this share of the LP within `TAIL_ROUNDS` rounds, or generation stops (its tail brings little). */
const TAIL_GAIN = 0.001;
const TAIL_ROUNDS = 40;
/** Work one LP iteration is counted as, in table cells per row of the master (a rough equivalence of time). */
const CELLS_PER_ITERATION_ROW = 50;

/** What column generation shares across rounds: the master, the work spent, and where to stop. */
export interface Generation {
  setup: PlanSetup;
  master: Master;
  work: number;
  budget: number;
  /** pricing multipliers per presented sheet (index into `setup.presentations`) */
  memories: PricingMemory[];
}

export const newGeneration = (setup: PlanSetup, solver: LpSolver, master: Master, budget: number): Generation => ({
  setup,
  master,
  work: 0,
  budget,
  memories: setup.presentations.map(() => new PricingMemory(solver, setup.blanks.length)),
});

export function disposeGeneration(generation: Generation): void {
  generation.master.dispose();
  for (const memory of generation.memories) memory.dispose();
}

/** The pieces still to place and the sheets still on hand. */
export interface Residual {
  wanted: number[];
  allowance: number[];
  onHand: (number | null)[];
}

export interface GenerationResult {
  /** "converged": no new pattern prices out; "settled": the bound can no longer rise to the next whole sheet (or rounds ran out); "budget": out of work */
  status: "converged" | "settled" | "budget" | "failed";
  solution: MasterSolution | null;
  /** the best Lagrangian lower bound found (sheets, fractional; 0 when none) */
  bound: number;
}

/** The master's rows and columns brought to the residual: demand, stock, and columns that could now over-produce retired. */
export function restrict(generation: Generation, residual: Residual): void {
  const { master } = generation;
  // Multipliers learned for other caps would mislead: pricing starts afresh.
  generation.memories.forEach((memory, index) => {
    memory.dispose();
    generation.memories[index] = new PricingMemory(memory.solver, generation.setup.blanks.length);
  });
  residual.wanted.forEach((count, blank) => master.setDemand(blank, count));
  residual.onHand.forEach((count, stock) => {
    if (count !== null) master.setOnHand(stock, count);
  });
  master.columns.forEach((column, index) => {
    const over = [...column.uses].some(([blank, count]) => count > residual.wanted[blank] + residual.allowance[blank]);
    if (over || residual.onHand[column.stock] === 0) master.retire(index);
  });
}

export interface GenerateOptions {
  /** sheets of a plan already known: stop once the bound proves it the fewest */
  known?: number;
  maxRounds: number;
  /** subgradient steps per presented sheet while patterns are found easily, and when looking harder */
  quickSteps: number;
  deepSteps: number;
}

/**
 * Generate columns for the residual until no pattern prices out (looking harder before giving
 * up), the bound is settled (when `settle`), `maxRounds` pass or the budget runs out.
 */
export function generate(generation: Generation, residual: Residual, options: GenerateOptions): GenerationResult {
  const { setup, master } = generation;
  const caps = residual.wanted.map((count, blank) => count + residual.allowance[blank]);
  const rows = residual.wanted.filter((count) => count > 0).length + 1;
  let bound = 0;
  let solution: MasterSolution | null = null;
  let center: Prices | null = null; // the prices with the best bound so far
  let centerBound = -Infinity;
  // Each round prices at prices smoothed toward the center; when that finds nothing, at the LP's own
  // prices; when that finds nothing, at those prices looking harder; when that finds nothing, done.
  let mode: "smoothed" | "current" | "deep" = "current";
  let bestGap = Infinity;
  let lastGain = 0;
  for (let round = 0; ; round++) {
    if (mode !== "deep" && (mode === "smoothed" || !solution)) {
      solution = master.solve();
      if (!solution) return { status: "failed", solution: null, bound };
      generation.work += solution.iterations * CELLS_PER_ITERATION_ROW * rows;
    }
    const current = solution!;
    const at: Prices =
      mode === "smoothed" && center
        ? mix(center, current, SMOOTHING)
        : { blankPrice: current.blankPrice, stockPrice: current.stockPrice };
    const bestPerStock = new Map<number, number>();
    let added = 0;
    for (const [index, way] of setup.presentations.entries()) {
      const onHand = residual.onHand[way.stock];
      if (onHand !== null && onHand <= 0) continue;
      const target = 1 + at.stockPrice[way.stock];
      const priced = priceWithCaps(
        way,
        at.blankPrice,
        caps,
        setup.tolerance,
        target,
        generation.memories[index],
        mode === "deep" ? options.deepSteps : options.quickSteps,
      );
      generation.work += priced.work;
      bestPerStock.set(way.stock, Math.max(bestPerStock.get(way.stock) ?? 0, priced.bound));
      if (!(priced.value > target + LP_EPSILON)) continue; // not worth writing: it would not lower the LP
      const offer = (strips: StripIn[]): boolean => {
        const candidate = writeCandidate(setup, way, strips, (blank) => residual.wanted[blank] > 0);
        if (!candidate) return false;
        let worth = 0; // at the LP's own prices: the column must lower the LP as it stands
        for (const [blank, count] of candidate.uses) worth += current.blankPrice[blank] * count;
        if (worth > 1 + current.stockPrice[way.stock] + LP_EPSILON && !master.has(way.stock, candidate.uses)) {
          master.add({ candidate, stock: way.stock, uses: candidate.uses });
          added += 1;
        }
        return candidate.pieces === strips.reduce((sum, strip) => sum + strip.pieces.length, 0);
      };
      if (!offer(priced.strips)) {
        // The program could not keep every piece (pieces filling a strip or the sheet exactly that the shear
        // would take for one another): price again leaving a little spare, which a lead-off cut takes away.
        const spare = Math.floor(setup.tolerance) + 1;
        const roomier = { ...way, length: way.length - spare, usableWidth: way.usableWidth - spare };
        const again = priceWithCaps(
          roomier,
          at.blankPrice,
          caps,
          setup.tolerance,
          target,
          generation.memories[index],
          1,
        );
        generation.work += again.work;
        if (again.value > target + LP_EPSILON) offer(again.strips);
      }
      for (const strips of priced.others) offer(strips);
    }
    const roundBound = lagrangianBound(residual, at.blankPrice, bestPerStock);
    if (roundBound > centerBound) {
      centerBound = roundBound;
      center = at;
    }
    bound = Math.max(bound, roundBound);
    const wholeBound = Math.ceil(bound - LP_EPSILON);
    if (wholeBound >= (options.known ?? Infinity)) return { status: "settled", solution: current, bound };
    // Tailing off: neither the LP nor the bound has moved for a while; what bound there is stands.
    const gap = current.objective - bound;
    if (!(gap >= bestGap - TAIL_GAIN * Math.max(1, current.objective))) {
      // the first round counts as a gain
      bestGap = gap;
      lastGain = round;
    } else if (round - lastGain >= TAIL_ROUNDS) return { status: "settled", solution: current, bound };
    if (added) mode = "smoothed";
    else if (mode === "deep") return { status: "converged", solution: current, bound };
    else mode = mode === "smoothed" ? "current" : "deep";
    if (generation.work > generation.budget) return { status: "budget", solution: current, bound };
    if (round + 1 >= options.maxRounds) return { status: "settled", solution: current, bound };
  }
}

interface Prices {
  blankPrice: Float64Array;
  stockPrice: Float64Array;
}

/** Prices a share `weight` of the way from `current` to `center` (dual smoothing, after Wentges). */
function mix(center: Prices, current: Prices, weight: number): Prices {
  const blend = (towards: Float64Array, from: Float64Array) =>
    towards.map((value, index) => weight * value + (1 - weight) * from[index]);
  return {
    blankPrice: blend(center.blankPrice, current.blankPrice),
    stockPrice: blend(center.stockPrice, current.stockPrice),
  };
}

/** The Lagrangian lower bound on sheets for placing all of `residual.wanted`, at these prices. */
export function lagrangianBound(
  residual: Residual,
  prices: ArrayLike<number>,
  bestPerStock: Map<number, number>,
): number {
  let theta = 1;
  for (const [stock, best] of bestPerStock) {
    if (residual.onHand[stock] === null && best > 1) theta = Math.min(theta, 1 / best);
  }
  let bound = 0;
  residual.wanted.forEach((count, blank) => {
    if (count > 0) bound += theta * count * prices[blank];
  });
  for (const [stock, best] of bestPerStock) {
    const onHand = residual.onHand[stock];
    if (onHand !== null) bound += onHand * Math.min(0, 1 - theta * best);
  }
  return bound;
}
