/** A sheet pattern going in (strips of pieces) and coming out as a cut program (cuts, placed pieces, leftovers). */
export interface PieceIn {
  blank: number;
  /** along the strip (along the blade when the strip is crosscut) */
  length: number;
  /** across the strip; at most the strip's width */
  width: number;
  turned: boolean;
}

export interface StripIn {
  /** across the sheet: the rip's backgauge setting */
  width: number;
  pieces: PieceIn[];
}

/** One cut group in the planner's grid units; `from` only where it is not the group just before. */
export interface PlanCut {
  backgauge: number;
  count: number;
  turn?: true;
  from?: number;
  scrap?: true;
  note: string;
}

export interface PlacedPiece extends PieceIn {
  x: number;
  y: number;
}

export interface PlacedStrip {
  y: number;
  width: number;
  pieces: PlacedPiece[];
}

export interface Leftover {
  x: number;
  y: number;
  /** along the blade */
  length: number;
  /** toward the backgauge */
  width: number;
  kind: "trim" | "sheet-end" | "strip-end" | "piece-trim";
}

export interface WrittenPattern {
  cuts: PlanCut[];
  strips: PlacedStrip[];
  leftovers: Leftover[];
  /** per sheet, from the shear core's piece flow */
  strokes: number;
  turns: number;
}
