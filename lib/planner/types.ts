/**
 * The planner's inputs and answer. Axis names throughout the planner: `length` runs along the
 * blade (a strip's length, a sheet as presented), `width` toward the backgauge (a strip's
 * width is the rip's backgauge setting). Integer dimensions on the caller's grid.
 */
import type { LpSolver } from "./lp-solver";
import type { Leftover, PlanCut } from "./written";

export interface Blank {
  label: string;
  length: number;
  width: number;
  quantity: number;
  /** may be turned 90° (false when grain or finish direction forbids it) */
  canTurn?: boolean;
}

export interface Stock {
  length: number;
  width: number;
  /** sheets on hand; null = as many as needed */
  count: number | null;
}

export type Objective = "fewest_sheets" | "least_waste" | "fewest_strokes";

/** How the plan's patterns were chosen: all sheets together by column generation, or one pattern after another (the greedy). */
export type PlanMethod = "column_generation" | "greedy";

export interface PlanOptions {
  objective?: Objective;
  /** trim cut off the sheet's first edge before ripping (0: none) */
  trim?: number;
  /** extra pieces allowed per blank, as a percentage of its quantity (rounded down); 0: never more than asked */
  overProductionPct?: number;
  /** leftovers at least this size (either way round) are reusable offcuts; null: none are */
  reusable?: { length: number; width: number } | null;
  /** count reusable offcuts as stock returned: they are not waste when patterns are scored and utilisation is reported */
  offcutsAsStock?: boolean;
  /** the shear: longest cut (the blade) and the backgauge's travel; null: no limits */
  limits?: { bladeLength: number; backgaugeMin: number; backgaugeMax: number } | null;
  /** millimetres per grid unit, for the piece-flow check of each pattern (default 1) */
  mmPerUnit?: number;
  /** how a grid length reads in the programs' notes and the reasons given (default: the number) */
  show?: (value: number) => string;
  /** told after every sheet pattern is chosen (for a progress report; must not change anything) */
  onProgress?: (progress: PlanProgress) => void;
  /** the LP solver for column generation (default: the process's own, loaded once) */
  lpSolver?: LpSolver;
  /** work, in table cells, column generation may spend before the plan is made pattern by pattern (default `PLAN_COLUMN_GENERATION_BUDGET`) */
  columnGenerationBudget?: number;
}

/** How far a plan has come: sheet patterns chosen and the pieces they place, of those wanted. */
export interface PlanProgress {
  patterns: number;
  piecesPlaced: number;
  piecesWanted: number;
}

/** "fewest_strokes" takes the patterns with fewest strokes and turns per blank among those within this much utilisation of the fullest. */
export const STROKES_UTILISATION_SLACK = 0.05;

/**
 * Knapsack work, in table cells, that one greedy plan may spend on tables for the exact set of
 * blanks still wanted; past it, a strip width reuses one table for every blank that fits it
 * (capped when the strip is filled, so a little less full) and the exact one-sheet pattern is
 * no longer tried. Keeps large orders (hundreds of blank types) to seconds; counted, so plans
 * stay reproducible.
 */
export const PLAN_WORK_BUDGET = 150_000_000;
/** Past this much work in all, strips are filled greedily, largest blank first: a plan of any size ends in seconds. */
export const PLAN_WORK_LIMIT = 2 * PLAN_WORK_BUDGET;
/**
 * Work, in table cells (LP iterations counted as cells too), that column generation may spend on
 * one plan; past it the plan keeps what is done and places the rest pattern by pattern. Counted,
 * not timed, so plans stay reproducible.
 */
export const PLAN_COLUMN_GENERATION_BUDGET = 1_000_000_000;

/** A piece on the sheet as presented (x along the blade); `turned` is relative to the stock sheet's length. */
export interface Placement {
  blank: number;
  x: number;
  y: number;
  length: number;
  width: number;
  turned: boolean;
}

export interface StripPlan {
  /** distance from the first edge, and the strip's width (the rip's backgauge setting) */
  y: number;
  width: number;
  pieces: Placement[];
}

export interface Offcut extends Leftover {
  reusable: boolean;
}

export interface SheetPattern {
  stock: number;
  /** the stock sheet's width is presented to the blade (its length is longer than the blade, or this way round was better) */
  rotated: boolean;
  /** the sheet as presented: length along the blade, width toward the backgauge */
  length: number;
  width: number;
  repeats: number;
  strips: StripPlan[];
  offcuts: Offcut[];
  cuts: PlanCut[];
  /** per sheet */
  strokes: number;
  turns: number;
  utilisation: number;
}

export interface Unplaced {
  blank: number;
  quantity: number;
  kind: "unplaceable" | "stock_short";
  reason: string;
}

export interface Plan {
  patterns: SheetPattern[];
  sheetsUsed: number;
  /** pieces placed per blank, over all repeats */
  produced: number[];
  /** pieces beyond the quantity asked, per blank (never more than the allowance) */
  extra: number[];
  unplaced: Unplaced[];
  /** stock sizes the shear cannot take either way round */
  unusableStock: number[];
  /** blank area over stock area */
  utilisation: number;
  /** blank area over stock area less the reusable offcuts */
  netUtilisation: number;
  reusable: { length: number; width: number; count: number }[];
  strokes: number;
  turns: number;
  /** how the patterns were chosen */
  method: PlanMethod;
  /** why the budget made the plan (or its last sheets) pattern by pattern; null when it did not */
  methodNote: string | null;
  /**
   * lower bounds on sheets: blank area over the largest sheet's usable area; pieces that cannot share a sheet
   * (`apartBound`; null when not computed); and the LP bound rounded up (null when not computed)
   */
  bounds: { area: number; apart: number | null; lp: number | null };
  /** no plan of two-stage patterns can cut the blanks this plan places (all it was asked for, when complete) from fewer sheets */
  lowerBound: number;
  /** the plan uses `lowerBound` sheets: provably the fewest */
  provenFewest: boolean;
}
