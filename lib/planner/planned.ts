/**
 * What a planned order is: its sheet patterns (cuts, strips stored as runs of alike pieces,
 * the pattern's program and check), its findings, and what planning it needs to know.
 */
import type { CheckResult, GradeProfile, ShearProfile } from "../shear";
import type { OrderBlank, OrderStock } from "./order-limits";
import type { Objective, PlanMethod } from "./plan";
export interface PlannedCut {
  backgauge: number;
  count: number;
  turn?: boolean;
  from?: number;
  length?: number;
  scrap?: boolean;
  note?: string;
}

export interface PlannedPattern {
  key: string;
  stock: number;
  sheet: { length: number; width: number };
  rotated: boolean;
  repeats: number;
  utilisationPct: number;
  /** runs: identical strips once with `repeat`, identical pieces side by side once with `count` */
  strips: PlannedStrip[];
  offcuts: {
    x: number;
    y: number;
    length: number;
    width: number;
    kind: "trim" | "sheet-end" | "strip-end" | "piece-trim";
    reusable: boolean;
  }[];
  strokes: number;
  turns: number;
  cuts: PlannedCut[];
  check: Pick<CheckResult, "validation" | "findings" | "estimate">;
}

export interface PieceRun {
  blank: number;
  label: string;
  x: number;
  y: number;
  length: number;
  width: number;
  turned: boolean;
  count: number;
}

export interface PlannedStrip {
  y: number;
  /** toward the backgauge */
  width: number;
  repeat: number;
  pieces: PieceRun[];
}

type PlacedPiece = Omit<PieceRun, "count">;

/**
 * Strips as runs, so a stored plan grows with its patterns, not its pieces: pieces of one blank
 * side by side along the blade become one run, and identical strips one after another one strip.
 */
export function compressStrips(strips: { y: number; width: number; pieces: PlacedPiece[] }[]): PlannedStrip[] {
  const runs = (pieces: PlacedPiece[]) => {
    const out: PieceRun[] = [];
    for (const piece of [...pieces].sort((a, b) => a.x - b.x || a.y - b.y)) {
      const last = out[out.length - 1];
      const follows =
        last &&
        last.blank === piece.blank &&
        last.turned === piece.turned &&
        last.y === piece.y &&
        last.length === piece.length &&
        last.width === piece.width &&
        Math.abs(last.x + last.count * last.length - piece.x) < 1e-9;
      if (follows) last.count += 1;
      else out.push({ ...piece, count: 1 });
    }
    return out;
  };
  // Two strips are alike when their runs are, each relative to the strip's own edge.
  const shape = (strip: { y: number; width: number; pieces: PieceRun[] }) =>
    JSON.stringify([
      strip.width,
      strip.pieces.map((r) => [r.blank, r.turned, r.x, r.y - strip.y, r.length, r.width, r.count]),
    ]);
  const out: (PlannedStrip & { key: string })[] = [];
  for (const strip of strips) {
    const pieces = runs(strip.pieces);
    const key = shape({ ...strip, pieces });
    const last = out[out.length - 1];
    if (last && last.key === key && Math.abs(last.y + last.repeat * last.width - strip.y) < 1e-9) last.repeat += 1;
    else out.push({ y: strip.y, width: strip.width, repeat: 1, pieces, key });
  }
  return out.map(({ key: _key, ...strip }) => strip);
}

export type PlanFindingCode =
  | "blank_unplaceable"
  | "stock_short"
  | "over_production"
  | "stock_unusable"
  | "trim_out_of_travel"
  | "pattern_not_releasable";

export interface PlanFinding {
  code: PlanFindingCode;
  severity: "error" | "warning";
  message: string;
  pointer: string;
  actual: number | null;
}

/** The planner's answer in the order's units. */
export interface PlannedOrder {
  coverage: "complete" | "partial";
  stock: (OrderStock & { count: number | null; used: number })[];
  blanks: (OrderBlank & { canTurn: boolean; planned: number; extra: number; short: number })[];
  options: {
    objective: Objective;
    trim: number;
    overProductionPct: number;
    reusableOffcut: { length: number; width: number } | null;
    offcutsAsStock: boolean;
  };
  summary: {
    sheets: number;
    patterns: number;
    blanksAsked: number;
    blanksPlanned: number;
    extra: number;
    short: number;
    utilisationPct: number;
    netUtilisationPct: number;
    strokes: number;
    turns: number;
    estimateSeconds: number;
    /** no plan of two-stage patterns can cut the blanks this plan places from fewer sheets (all it was asked for, when complete) */
    lowerBoundSheets: number;
    /** the plan uses `lowerBoundSheets` sheets: provably the fewest */
    provenFewest: boolean;
    /** the bounds behind `lowerBoundSheets`: blank area over the largest usable sheet, pieces that cannot share a sheet, and the LP over all two-stage patterns (null when not computed, or the LP's when the plan is partial) */
    bounds: { areaSheets: number; apartSheets: number | null; lpSheets: number | null };
    method: PlanMethod;
    /** why the work budget made the plan, or its last sheets, pattern by pattern; null when it did not */
    methodNote: string | null;
  };
  patterns: PlannedPattern[];
  reusableOffcuts: { length: number; width: number; count: number }[];
  findings: PlanFinding[];
}

export interface PlanContext {
  shear: ShearProfile;
  grade: GradeProfile | null;
}
