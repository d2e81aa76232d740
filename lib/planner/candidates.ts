/**
 * Sheet patterns as candidates: strips written as a cut program and proven by the shear core's
 * piece flow (`program.ts`), giving up pieces from the end when no order of groups can express
 * them, then scored by the objective. Also what every part of the planner shares about one
 * plan (`PlanSetup`).
 */
import { REMNANT_TOLERANCE_MM } from "../shear/flow";
import { isReusable, present, variantsOf, type Presentation } from "./presentation";
import { writePattern } from "./program";
import { type PlacedStrip, type PlanCut, type StripIn } from "./written";
import {
  STROKES_UTILISATION_SLACK,
  type Blank,
  type Objective,
  type Offcut,
  type PlanOptions,
  type SheetPattern,
  type Stock,
} from "./types";

/** Options with their defaults filled in. */
export type SetupOptions = PlanOptions & {
  objective: Objective;
  trim: number;
  overProductionPct: number;
  mmPerUnit: number;
};

/** What every part of one plan shares: the blanks, the options, and how each sheet meets the blade. */
export interface PlanSetup {
  stock: Stock[];
  blanks: Blank[];
  options: SetupOptions;
  presentations: Presentation[];
  /** stock sizes the shear cannot take either way round */
  unusable: number[];
  /** the shear core's remnant tolerance, in grid units */
  tolerance: number;
  gauge: { min: number; max: number };
}

export function planSetup(stock: Stock[], blanks: Blank[], options: PlanOptions): PlanSetup {
  const filled: SetupOptions = { objective: "fewest_sheets", trim: 0, overProductionPct: 0, mmPerUnit: 1, ...options };
  const { presentations, unusable } = present(stock, variantsOf(blanks), filled);
  return {
    stock,
    blanks,
    options: filled,
    presentations,
    unusable,
    tolerance: REMNANT_TOLERANCE_MM / filled.mmPerUnit,
    gauge: { min: filled.limits?.backgaugeMin ?? 0, max: filled.limits?.backgaugeMax ?? Infinity },
  };
}

/** A sheet pattern whose program is written and proven, with what it makes. */
export interface Candidate {
  way: Presentation;
  strips: PlacedStrip[];
  offcuts: Offcut[];
  cuts: PlanCut[];
  strokes: number;
  turns: number;
  blanksArea: number;
  reusableArea: number;
  pieces: number;
  /** pieces per blank on one sheet */
  uses: Map<number, number>;
}

/**
 * Write strips on a sheet as a proven program. When no order of groups satisfies the remnant rule
 * (two pieces that the shear cannot tell apart, say), pieces are given up from the end until the
 * program makes exactly what it shows. Null when nothing is left that `useful` says is wanted.
 */
export function writeCandidate(
  setup: PlanSetup,
  way: Presentation,
  first: StripIn[],
  useful: (blank: number) => boolean,
): Candidate | null {
  const { options, gauge } = setup;
  const servesDemand = (strips: StripIn[]) => strips.some((strip) => strip.pieces.some((piece) => useful(piece.blank)));
  let strips = first;
  if (!servesDemand(strips)) return null;
  const sheet = { length: way.length, width: way.width };
  let written = writePattern(sheet, options.trim, strips, options.mmPerUnit, gauge, options.show);
  while (!written && strips.length) {
    const last = strips[strips.length - 1];
    strips =
      last.pieces.length > 1
        ? [...strips.slice(0, -1), { ...last, pieces: last.pieces.slice(0, -1) }]
        : strips.slice(0, -1);
    if (strips.length) written = writePattern(sheet, options.trim, strips, options.mmPerUnit, gauge, options.show);
  }
  if (!written || !servesDemand(strips)) return null;
  const offcuts = written.leftovers.map((leftover) => ({
    ...leftover,
    reusable: leftover.kind !== "trim" && isReusable(leftover, options.reusable),
  }));
  const uses = new Map<number, number>();
  let blanksArea = 0;
  let pieces = 0;
  for (const strip of written.strips) {
    for (const piece of strip.pieces) {
      uses.set(piece.blank, (uses.get(piece.blank) ?? 0) + 1);
      blanksArea += piece.length * piece.width;
      pieces += 1;
    }
  }
  const reusableArea = offcuts
    .filter((offcut) => offcut.reusable)
    .reduce((sum, offcut) => sum + offcut.length * offcut.width, 0);
  return {
    way,
    strips: written.strips,
    offcuts,
    cuts: written.cuts,
    strokes: written.strokes,
    turns: written.turns,
    blanksArea,
    reusableArea,
    pieces,
    uses,
  };
}

/** Share of the sheet the objective counts as used: blanks, plus kept offcuts when they count as stock. */
export const candidateFill = (candidate: Candidate, options: PlanOptions) =>
  (candidate.blanksArea + (options.offcutsAsStock ? candidate.reusableArea : 0)) /
  (candidate.way.length * candidate.way.width);

/** The objective's pick among candidate patterns for the next sheets. */
export function choose(candidates: Candidate[], options: PlanOptions): Candidate {
  const fill = (candidate: Candidate) => candidateFill(candidate, options);
  const best = (score: (candidate: Candidate) => number, tie: (candidate: Candidate) => number) =>
    candidates.reduce((kept, candidate) => {
      const difference = score(candidate) - score(kept);
      return difference > 1e-12 || (Math.abs(difference) <= 1e-12 && tie(candidate) > tie(kept)) ? candidate : kept;
    });
  switch (options.objective) {
    case "least_waste":
      return best(fill, (candidate) => candidate.blanksArea);
    case "fewest_strokes": {
      const top = Math.max(...candidates.map(fill));
      const near = candidates.filter((candidate) => fill(candidate) >= top - STROKES_UTILISATION_SLACK);
      const work = (candidate: Candidate) => (candidate.strokes + candidate.turns) / candidate.pieces;
      return near.reduce((kept, candidate) => {
        const difference = work(candidate) - work(kept);
        return difference < -1e-12 || (Math.abs(difference) <= 1e-12 && fill(candidate) > fill(kept))
          ? candidate
          : kept;
      });
    }
    default:
      return best((candidate) => candidate.blanksArea, fill);
  }
}

/** A chosen candidate as the plan's sheet pattern, cut `repeats` times. */
export function toSheetPattern(candidate: Candidate, repeats: number): SheetPattern {
  const { way } = candidate;
  return {
    stock: way.stock,
    rotated: way.rotated,
    length: way.length,
    width: way.width,
    repeats,
    strips: candidate.strips.map((strip) => ({
      y: strip.y,
      width: strip.width,
      pieces: strip.pieces.map((piece) => ({
        blank: piece.blank,
        x: piece.x,
        y: piece.y,
        length: piece.length,
        width: piece.width,
        turned: piece.turned,
      })),
    })),
    offcuts: candidate.offcuts,
    cuts: candidate.cuts,
    strokes: candidate.strokes,
    turns: candidate.turns,
    utilisation: candidate.blanksArea / (way.length * way.width),
  };
}
