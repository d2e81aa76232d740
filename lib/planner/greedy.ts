/**
 * The greedy plan, pattern by pattern: for every stock size still on hand (presented either
 * way round the blade allows), build candidate patterns for what is still wanted (strips
 * chosen by value per unit of width or by area, each filled by a knapsack along the strip and
 * capped by what is still wanted, and the exact one-sheet optimum when no blank can run out),
 * take the objective's pick, repeat it as often as the demand and the stock allow, and go
 * again. Fast and never over-produces beyond the allowance; used alone when a plan's work
 * budget does not allow planning all sheets together, and to place what is left over after.
 */
import { choose, toSheetPattern, writeCandidate, type Candidate, type PlanSetup } from "./candidates";
import { newStripTables, type StripTables } from "./knapsack";
import type { StripIn } from "./written";
import { buildStrips, exactPattern } from "./strips";
import type { SheetPattern } from "./types";

export interface GreedyResult {
  patterns: SheetPattern[];
  /** the candidate each pattern was made from */
  chosen: Candidate[];
  /** pieces per blank these patterns make */
  produced: number[];
  /** sheets left on hand per stock size (null: as many as needed) */
  onHand: (number | null)[];
  /** knapsack cells spent */
  work: number;
}

/**
 * Place `wanted` pieces per blank (0 for blanks no sheet can take), with up to `allowance` more
 * per blank, on the sheets `onHand`. `onPattern` hears each pattern as it is chosen.
 */
export function planGreedy(
  setup: PlanSetup,
  wanted: number[],
  allowance: number[],
  onHand: (number | null)[],
  onPattern?: (pattern: SheetPattern) => void,
  tables: StripTables = newStripTables(),
): GreedyResult {
  const { options } = setup;
  const produced = wanted.map(() => 0);
  const left = [...onHand];
  const patterns: SheetPattern[] = [];
  const chosen: Candidate[] = [];
  const exactStrips = options.objective === "fewest_strokes" ? [false, true] : [false];
  for (;;) {
    const need = wanted.map((count, blank) => Math.max(0, count - produced[blank]));
    if (!need.some((count) => count > 0)) break;
    const cap = wanted.map((count, blank) => Math.max(0, count + allowance[blank] - produced[blank]));
    const useful = (blank: number) => need[blank] > 0;
    const candidates: Candidate[] = [];
    const consider = (way: Candidate["way"], strips: StripIn[] | null) => {
      const candidate = strips && writeCandidate(setup, way, strips, useful);
      if (candidate) candidates.push(candidate);
    };
    for (const way of setup.presentations) {
      const sheetsLeft = left[way.stock];
      if (sheetsLeft !== null && sheetsLeft <= 0) continue;
      for (const exact of exactStrips) {
        for (const rule of ["density", "area"] as const)
          consider(way, buildStrips(way, cap, rule, exact, setup.tolerance, tables));
      }
      consider(way, exactPattern(way, cap, tables));
    }
    if (!candidates.length) break;
    const best = choose(candidates, options);
    const repeats = repeatsFor(best.uses, cap, need, left[best.way.stock]);
    for (const [blank, count] of best.uses) produced[blank] += count * repeats;
    const sheetsLeft = left[best.way.stock];
    if (sheetsLeft !== null) left[best.way.stock] = sheetsLeft - repeats;
    const pattern = toSheetPattern(best, repeats);
    patterns.push(pattern);
    chosen.push(best);
    onPattern?.(pattern);
  }
  return { patterns, chosen, produced, onHand: left, work: tables.work };
}

/**
 * How often to cut a pattern: while every blank on it stays within its cap, no more often than
 * some blank on it is still wanted, and within the sheets on hand; at least once.
 */
export function repeatsFor(
  uses: Map<number, number>,
  cap: number[],
  need: number[],
  sheetsLeft: number | null,
): number {
  let repeats = Infinity;
  let useful = 0;
  for (const [blank, count] of uses) {
    repeats = Math.min(repeats, Math.floor(cap[blank] / count));
    if (need[blank] > 0) useful = Math.max(useful, Math.ceil(need[blank] / count));
  }
  repeats = Math.min(repeats, useful);
  if (sheetsLeft !== null) repeats = Math.min(repeats, sheetsLeft);
  return Math.max(1, repeats);
}
