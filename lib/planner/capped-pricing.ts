/**
 * Pricing that keeps the caps across strips: Lagrangian relaxation of the cap on each blank
 * (no pattern holds more of it than wanted plus the allowance). For multipliers μ ≥ 0 the
 * relaxed pricing (`pricing.ts`) at values price − μ, plus Σ μ·cap, bounds every pattern that
 * keeps the caps. The multipliers come from a small LP over the relaxed patterns seen so far
 * (Kelley's cutting planes: the most a mix of them is worth within the caps, whose row duals
 * are the next μ); each relaxed pattern, made to keep the caps, is also a pattern to offer.
 * Stops as soon as a pattern worth more than `target` is found, the bound shows there is none,
 * or the LP meets the bound (no multipliers do better). The LP and its patterns are kept per
 * presented sheet between rounds, so later rounds start close.
 */
import type { LpSolver } from "./lp-solver";
import type { Presentation } from "./presentation";
import type { StripIn } from "./written";
import { priceSheet } from "./pricing";

/** A pattern must beat the target by this much to count (the same margin a column needs to enter the LP). */
export const PRICE_MARGIN = 1e-6;
/** Relaxed patterns the multipliers' LP keeps per presented sheet. */
const KEPT_PATTERNS = 64;

/** What one presented sheet keeps between rounds: the multipliers, and the LP over its relaxed patterns. */
export class PricingMemory {
  readonly multipliers: Float64Array;
  private model: ReturnType<LpSolver["createModel"]> | null = null;
  /** piece counts per blank of each relaxed pattern (the LP's columns), sparse */
  private readonly patterns: { blanks: number[]; counts: number[] }[] = [];

  constructor(
    readonly solver: LpSolver,
    private readonly blankCount: number,
  ) {
    this.multipliers = new Float64Array(blankCount);
  }

  /** Add a relaxed pattern and solve again at these prices and caps; the new multipliers and the LP's value (the most the mix is worth). */
  next(uses: number[], prices: ArrayLike<number>, caps: number[]): number | null {
    const { solver } = this;
    if (!this.model) {
      this.model = solver.createModel();
      this.model.options.set({ output_flag: false, presolve: "off", solver: "simplex" });
      const none = { indices: [], values: [] };
      for (let blank = 0; blank <= this.blankCount; blank++)
        this.model.addRow(-solver.infinity, blank < this.blankCount ? caps[blank] : 1, none);
    }
    const model = this.model;
    const blanks: number[] = [];
    const counts: number[] = [];
    uses.forEach((count, blank) => {
      if (count > 0) {
        blanks.push(blank);
        counts.push(count);
      }
    });
    if (this.patterns.length >= KEPT_PATTERNS) {
      // forget the oldest half: they were priced at other multipliers
      const forget = this.patterns.length - KEPT_PATTERNS / 2;
      model.deleteCols({ kind: "range", from: 0, to: forget - 1 });
      this.patterns.splice(0, forget);
    }
    this.patterns.push({ blanks, counts });
    model.addCol(0, 0, solver.infinity, { indices: [...blanks, this.blankCount], values: [...counts, 1] });
    // Prices and caps change between rounds: every column's worth and every row's cap are set afresh.
    model.changeRowsBounds(
      { kind: "range", from: 0, to: this.blankCount - 1 },
      new Float64Array(this.blankCount).fill(-solver.infinity),
      Float64Array.from(caps),
    );
    const costs = this.patterns.map(
      (pattern) =>
        -pattern.blanks.reduce((sum, blank, index) => sum + Math.max(0, prices[blank]) * pattern.counts[index], 0),
    );
    model.changeColsCost({ kind: "range", from: 0, to: this.patterns.length - 1 }, Float64Array.from(costs));
    const run = model.run();
    if (run.modelStatus !== solver.constants.modelStatus.optimal) return null;
    const duals = model.getSolution().rowDual;
    for (let blank = 0; blank < this.blankCount; blank++)
      this.multipliers[blank] = prices[blank] > 0 ? Math.max(0, -duals[blank]) : 0;
    return -model.getObjectiveValue();
  }

  dispose(): void {
    this.model?.dispose();
    this.model = null;
  }
}

export interface CappedPrice {
  /** no pattern on this sheet that keeps the caps is worth more at these prices */
  bound: number;
  /** the most valuable pattern found that keeps the caps and the shear's rules, and its worth */
  strips: StripIn[];
  value: number;
  /** every other pattern found worth more than the target */
  others: StripIn[][];
  /** table cells computed */
  work: number;
}

export function priceWithCaps(
  way: Presentation,
  prices: ArrayLike<number>,
  caps: number[],
  tolerance: number,
  target: number,
  memory: PricingMemory,
  maxSteps: number,
): CappedPrice {
  const multipliers = memory.multipliers;
  const adjusted = new Float64Array(caps.length);
  let bound = Infinity;
  let value = 0;
  let strips: StripIn[] = [];
  const others: StripIn[][] = [];
  let work = 0;
  for (let step = 0; step < maxSteps; step++) {
    let offset = 0;
    for (let blank = 0; blank < caps.length; blank++) {
      if (!(prices[blank] > 0)) multipliers[blank] = 0;
      adjusted[blank] = prices[blank] - multipliers[blank];
      offset += multipliers[blank] * caps[blank];
    }
    const priced = priceSheet(way, adjusted, caps, tolerance);
    work += priced.work;
    bound = Math.min(bound, priced.bound + offset);
    let worth = 0;
    for (const strip of priced.strips) for (const piece of strip.pieces) worth += prices[piece.blank];
    if (worth > value) {
      if (value > target + PRICE_MARGIN) others.push(strips);
      value = worth;
      strips = priced.strips;
    } else if (worth > target + PRICE_MARGIN) others.push(priced.strips);
    if (value > target + PRICE_MARGIN || bound <= target + PRICE_MARGIN || step + 1 >= maxSteps) break;
    const mixed = memory.next(priced.relaxedUses, prices, caps);
    work += caps.length * 50; // the small LP, roughly
    if (mixed === null || bound - mixed <= PRICE_MARGIN) break; // no multipliers would lower the bound further
  }
  return { bound, strips, value, others, work };
}
