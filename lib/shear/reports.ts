/**
 * Types of the reports the core returns, in the caller's units (each report
 * says which units it uses). Plain TypeScript, no runtime code.
 */
import type { AreaUnit, Finding, ForceUnit, GaugeFamily, LengthUnit, StrengthUnit, Validation } from "./types";

export interface Quantity {
  value: number;
  unit: string;
}

export interface SetupValue extends Quantity {
  source: "computed" | "given";
  /** One short sentence an operator can read: the rule and its inputs. */
  why: string;
}

export interface SetupReport {
  /** The gap the material needs (the gap at the ends). */
  bladeGap: SetupValue;
  /** Gap to set at the ends of the blade. */
  gapEnds: SetupValue;
  /** Gap to set at the centre: the ends less the crown. */
  gapCentre: SetupValue;
  rake: SetupValue;
  holdDown: SetupValue;
  crown: SetupValue;
  backgaugeRetract: SetupValue;
}

export interface ThicknessReport {
  value: number;
  unit: LengthUnit;
  source: "value" | "gauge";
  gauge: number | null;
  gaugeFamily: GaugeFamily | null;
}

export interface GroupForce {
  group: number;
  cutLength: number;
  force: number;
  model: "raked" | "straight";
}

export interface ForceReport {
  unit: ForceUnit;
  /** Largest force of any group, sharp blades, at the setup's rake. */
  required: number;
  /** Force at the shear's rating (rated thickness, tensile and rake). */
  rated: number;
  capacityUsedPct: number;
  dullBlade: { factor: number; required: number; capacityUsedPct: number };
  rakeDeg: number;
  tensile: { value: number; unit: StrengthUnit; basis: "minimum" | "typical" };
  maxThicknessForGrade: { value: number; unit: LengthUnit; source: "shear-profile" | "model"; why: string };
  byGroup: GroupForce[];
}

export interface PieceReport {
  group: number;
  /** Dimension cut by the backgauge. */
  width: number;
  /** Dimension along the blade. */
  length: number;
  count: number;
}

export interface GroupYield {
  group: number;
  /** Workpieces this group ran on, per sheet. */
  workpieces: number;
  strokes: number;
  /** Pieces the group made, per sheet. */
  pieces: PieceReport[];
  /** What became of this group's pieces. */
  piecesBecome: "blanks" | "offcut" | "turned";
}

export interface YieldTotals {
  blanks: number;
  blankArea: number;
  offcutPieces: number;
  offcutArea: number;
  turnedPieces: number;
  strokes: number;
  stockArea: number;
}

export interface YieldReport {
  lengthUnit: LengthUnit;
  areaUnit: AreaUnit;
  sheets: number;
  perSheet: YieldTotals;
  total: YieldTotals;
  utilisationPct: number;
  /** A remnant within this of a piece's size was counted as that piece (the shear's backgauge repeatability, or the default). */
  remnantToleranceMm: number;
  groups: GroupYield[];
  /** Blank sizes, totals over all sheets. */
  blanks: PieceReport[];
  /** Offcut sizes, totals over all sheets (group = -1 for the last remnant of the stock). */
  offcuts: PieceReport[];
}

export interface EstimateReport {
  strokes: number;
  backgaugeMoves: number;
  turns: number;
  sheets: number;
  seconds: { strokes: number; backgauge: number; turns: number; sheets: number; total: number };
}

/** One rectangle of the sheet as cut, in drawing coordinates (see `LayoutReport`). */
export interface LaidRectangle {
  kind: "blank" | "scrap" | "offcut";
  /** Group that made it (−1: the stock sheet, never cut). */
  group: number;
  /** 1-based stroke on the sheet, in cutting order, that cut it off; null for a remnant taken as a piece and for offcut left over. */
  stroke: number | null;
  x: number;
  y: number;
  /** Extent along x (the sheet's length, along the blade). */
  length: number;
  /** Extent along y (the sheet's width, toward the backgauge). */
  width: number;
}

export interface LaidCut {
  group: number;
  stroke: number;
  x1: number;
  y1: number;
  x2: number;
  y2: number;
  /** A partial stroke: it cuts part of the edge and severs nothing. */
  partial: boolean;
}

/**
 * One sheet as it is cut, from the piece flow: x along the sheet's length (the
 * edge first presented to the blade), y along its width toward the backgauge,
 * origin at the corner where the first strip is cut; in the program's units.
 */
export interface LayoutReport {
  unit: LengthUnit;
  rectangles: LaidRectangle[];
  cuts: LaidCut[];
}

export interface CheckResult {
  validation: Validation;
  units: LengthUnit | null;
  findings: Finding[];
  thickness: ThicknessReport | null;
  setup: SetupReport | null;
  force: ForceReport | null;
  yield: YieldReport | null;
  estimate: EstimateReport | null;
}
