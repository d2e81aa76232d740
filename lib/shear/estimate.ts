/**
 * Cycle estimate: strokes × stroke time + backgauge moves × travel time +
 * handling per turned piece and per sheet. Machine constants come from the
 * shear profile; the stroke-time split below is ours.
 */
import type { ShearProfile } from "./types";
import type { EstimateReport } from "./reports";
import type { FlowCut, FlowResult } from "./flow";
import { DECIMALS, roundTo } from "./units";

/**
 * Stroke time (ours): a share of a full stroke is fixed (approach, reversal,
 * return); the rest scales with the blade travel the cut needs, t + L · tan α,
 * against the travel of a full stroke, t_rated + blade length · tan(max rake).
 */
export const STROKE_FIXED_FRACTION = 0.4;

const RAD_PER_DEG = Math.PI / 180;
/** Backgauge positions closer than this, mm, are the same position (no move). */
const SAME_POSITION_MM = 1e-6;

/** Seconds for one stroke cutting `cutLengthMm` of `thicknessMm` plate at `rakeDeg`. */
export function strokeSeconds(cutLengthMm: number, thicknessMm: number, rakeDeg: number, shear: ShearProfile): number {
  const full = 60 / shear.strokesPerMin;
  const fullTravel = shear.ratedThicknessMm + shear.bladeLengthMm * Math.tan(shear.rakeMaxDeg * RAD_PER_DEG);
  const travel = thicknessMm + cutLengthMm * Math.tan(Math.max(0, rakeDeg) * RAD_PER_DEG);
  const share = fullTravel > 0 ? Math.min(1, Math.max(0, travel / fullTravel)) : 1;
  return full * (STROKE_FIXED_FRACTION + (1 - STROKE_FIXED_FRACTION) * share);
}

export interface CycleEstimate {
  strokes: number;
  backgaugeMoves: number;
  turns: number;
  sheets: number;
  seconds: { strokes: number; backgauge: number; turns: number; sheets: number; total: number };
}

export interface EstimateInput {
  flow: FlowResult;
  cuts: readonly FlowCut[];
  sheets: number;
  shear: ShearProfile;
  rakeDeg: number;
  thicknessMm: number;
}

/**
 * Backgauge moves: the gauge is set to the first running group before the
 * first sheet (not counted), moves whenever the next running group's setting
 * differs, and moves back for each further sheet when the last and first
 * settings differ. Travel at the profile's backgauge speed.
 */
function backgaugeTravel(flow: FlowResult, cuts: readonly FlowCut[], sheets: number): { moves: number; mm: number } {
  const positions: number[] = [];
  for (const g of flow.groups) if (g.strokes > 0) positions.push(cuts[g.index].backgaugeMm);
  if (positions.length === 0) return { moves: 0, mm: 0 };
  let moves = 0;
  let mm = 0;
  for (let i = 1; i < positions.length; i++) {
    const distance = Math.abs(positions[i] - positions[i - 1]);
    if (distance > SAME_POSITION_MM) {
      moves++;
      mm += distance;
    }
  }
  const back = Math.abs(positions[positions.length - 1] - positions[0]);
  const returns = back > SAME_POSITION_MM ? sheets - 1 : 0;
  return { moves: moves * sheets + returns, mm: mm * sheets + back * returns };
}

/** Estimate the run time of `sheets` sheets. */
export function estimateCycle(estimateInput: EstimateInput): CycleEstimate {
  let strokeSecondsPerSheet = 0;
  for (const group of estimateInput.flow.groups) {
    if (group.strokes > 0)
      strokeSecondsPerSheet +=
        group.strokes *
        strokeSeconds(group.cutLengthMm, estimateInput.thicknessMm, estimateInput.rakeDeg, estimateInput.shear);
  }
  const gauge = backgaugeTravel(estimateInput.flow, estimateInput.cuts, estimateInput.sheets);
  const turns = estimateInput.flow.turnedPieces * estimateInput.sheets;
  const seconds = {
    strokes: strokeSecondsPerSheet * estimateInput.sheets,
    backgauge: estimateInput.shear.backgaugeSpeedMmPerS > 0 ? gauge.mm / estimateInput.shear.backgaugeSpeedMmPerS : 0,
    turns: turns * estimateInput.shear.handlingSecondsPerTurn,
    sheets: estimateInput.sheets * estimateInput.shear.handlingSecondsPerSheet,
    total: 0,
  };
  seconds.total = seconds.strokes + seconds.backgauge + seconds.turns + seconds.sheets;
  return {
    strokes: estimateInput.flow.strokes * estimateInput.sheets,
    backgaugeMoves: gauge.moves,
    turns,
    sheets: estimateInput.sheets,
    seconds,
  };
}

/** The estimate as reported: seconds rounded to DECIMALS.seconds. */
export function estimateReport(cycleEstimate: CycleEstimate): EstimateReport {
  const seconds = (v: number): number => roundTo(v, DECIMALS.seconds);
  return {
    strokes: cycleEstimate.strokes,
    backgaugeMoves: cycleEstimate.backgaugeMoves,
    turns: cycleEstimate.turns,
    sheets: cycleEstimate.sheets,
    seconds: {
      strokes: seconds(cycleEstimate.seconds.strokes),
      backgauge: seconds(cycleEstimate.seconds.backgauge),
      turns: seconds(cycleEstimate.seconds.turns),
      sheets: seconds(cycleEstimate.seconds.sheets),
      total: seconds(cycleEstimate.seconds.total),
    },
  };
}
