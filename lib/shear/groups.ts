/**
 * Checks of every cut group against the shear and the piece flow: backgauge
 * travel and repeatability, lengths of cut, partial strokes, strokes that cut
 * nothing, and strips likely to twist, bow or curve.
 */
import type { Finding, LengthUnit, ShearProfile } from "./types";
import type { FlowCut, FlowResult } from "./flow";
import { finding } from "./findings";
import { fmtLength, showLength } from "./units";

/** Narrow strip rule (ours): warn below this many thicknesses of width… */
export const NARROW_STRIP_WIDTH_PER_THICKNESS = 10;
/** …or when the strip is longer than this many widths. */
export const NARROW_STRIP_LENGTH_PER_WIDTH = 50;
/**
 * Distortion rule (ours): at rake α (degrees), strips narrower than this many
 * thicknesses per degree of rake are likely to twist, bow and camber. The
 * trade fact is that distortion of narrow strips grows with rake and falls as
 * the strip widens against its thickness (common practice; the stainless
 * producers' fabrication guidance, SSINA: small rake angles "require higher
 * power, but cause less distortion"; a plate maker's shearing guidance: "a
 * larger rake angle increases the risk of … twisting");
 * the proportional threshold is ours. At 0.5° it meets the narrow-strip rule
 * (10 × thickness).
 */
export const STRIP_DISTORTION_WIDTH_PER_THICKNESS_DEGREE = 20;
/** Settings closer than this, mm, are the same setting (floating-point noise, not a difference asked for). */
const SAME_SETTING_MM = 1e-6;

export interface FlowCheckInput {
  flow: FlowResult;
  cuts: readonly FlowCut[];
  /** Cuts whose fields were invalid (already reported); skipped here. */
  skip: readonly boolean[];
  shear: ShearProfile | null;
  thicknessMm: number | null;
  /** The rake the program runs at (computed or given), degrees; null when unknown. */
  rakeDeg?: number | null;
  units: LengthUnit;
}

const groupName = (index: number): string => `group ${index + 1}`;
const capital = (text: string): string => text.charAt(0).toUpperCase() + text.slice(1);
const plural = (count: number, one: string, many: string): string => `${count} ${count === 1 ? one : many}`;

/** Where a group's presented edge comes from: the sheet's length, its width (first group turned), or an earlier group. */
function presentedEdgePointer(cuts: readonly FlowCut[], index: number): string {
  for (let earlier = 1; earlier <= index; earlier++) if (cuts[earlier].turn) return `/cuts/${index}`;
  return cuts[0]?.turn ? "/sheet/width" : "/sheet/length";
}

/** Checks of every group against the shear and the piece flow. */
export function checkGroups(input: FlowCheckInput): Finding[] {
  const out: Finding[] = [];
  const units = input.units;
  if (input.cuts.length === 0) {
    out.push(finding("program_cuts_nothing", "/cuts", "The program has no cut groups, so it cuts nothing."));
    return out;
  }
  for (const group of input.flow.groups) {
    const index = group.index;
    if (input.skip[index]) continue;
    const cut = input.cuts[index];
    const at = `/cuts/${index}`;
    // A group of 0 strokes only names the remnant as its piece: the backgauge is not set for it.
    if (input.shear && cut.count > 0) out.push(...checkBackgaugeTravel(cut, index, input.shear, units));
    if (cut.count === 0 && group.pieces.length === 0) {
      out.push(
        finding(
          "group_cuts_nothing",
          `${at}/count`,
          `${capital(groupName(index))} has nothing to cut: its count is 0.`,
          null,
          0,
          "strokes",
        ),
      );
      continue;
    }
    if (group.workpieces === 0) {
      const source = cut.from ?? index - 1;
      const reason = cut.turn
        ? `group ${source + 1} left no pieces to turn`
        : "the groups before it used up the workpiece";
      out.push(
        finding(
          "group_cuts_nothing",
          at,
          `${capital(groupName(index))} has nothing to cut: ${reason}.`,
          null,
          0,
          "workpieces",
        ),
      );
      continue;
    }
    if (input.shear && group.cutLengthMm > input.shear.bladeLengthMm) {
      const pointer = cut.lengthMm !== null ? `${at}/length` : presentedEdgePointer(input.cuts, index);
      const message = `${capital(groupName(index))} cuts ${fmtLength(group.cutLengthMm, units)}, longer than this shear's ${fmtLength(input.shear.bladeLengthMm, units)} blade.`;
      out.push(
        finding(
          "cut_length_over_blade",
          pointer,
          message,
          showLength(input.shear.bladeLengthMm, units),
          showLength(group.cutLengthMm, units),
          units,
        ),
      );
    }
    if (group.lengthOverWorkpiece && cut.lengthMm !== null) {
      const message = `${capital(groupName(index))} gives a length of cut of ${fmtLength(cut.lengthMm, units)}, longer than the ${fmtLength(group.presentedEdgeMm, units)} edge it presents to the blade.`;
      out.push(
        finding(
          "cut_length_over_workpiece",
          `${at}/length`,
          message,
          showLength(group.presentedEdgeMm, units),
          showLength(cut.lengthMm, units),
          units,
        ),
      );
    }
    if (group.partial && cut.lengthMm !== null) {
      const message = `${capital(groupName(index))} cuts ${fmtLength(cut.lengthMm, units)} of a ${fmtLength(group.presentedEdgeMm, units)} edge: these strokes do not cut a piece off, so no pieces are counted from them.`;
      out.push(
        finding(
          "partial_stroke",
          `${at}/length`,
          message,
          showLength(group.presentedEdgeMm, units),
          showLength(cut.lengthMm, units),
          units,
        ),
      );
    }
    if (group.beyond !== null) {
      const beyond = group.beyond;
      const message = `In ${groupName(index)}, stroke ${beyond.firstStroke} is set at ${fmtLength(cut.backgaugeMm, units)} but only ${fmtLength(beyond.remainingMm, units)} of workpiece is left: ${plural(beyond.strokes, "stroke", "strokes")} per sheet cut nothing.`;
      out.push(
        finding(
          "backgauge_beyond_workpiece",
          `${at}/backgauge`,
          message,
          showLength(beyond.remainingMm, units),
          showLength(cut.backgaugeMm, units),
          units,
        ),
      );
    }
    if (!cut.scrap && group.pieces.length > 0) {
      const narrow = checkNarrowStrip(cut, group.presentedEdgeMm, index, input.thicknessMm, units);
      out.push(...narrow);
      if (narrow.length === 0)
        out.push(...checkStripDistortion(cut, index, input.thicknessMm, input.rakeDeg ?? null, input.shear, units));
    }
  }
  if (input.shear) out.push(...checkBackgaugeRepeatability(input.cuts, input.skip, input.shear, units));
  return out;
}

function checkBackgaugeTravel(cut: FlowCut, index: number, shear: ShearProfile, units: LengthUnit): Finding[] {
  const setting = cut.backgaugeMm;
  if (setting >= shear.backgaugeMinMm && setting <= shear.backgaugeMaxMm) return [];
  const bound = setting < shear.backgaugeMinMm ? shear.backgaugeMinMm : shear.backgaugeMaxMm;
  const message = `Backgauge ${fmtLength(setting, units)} in ${groupName(index)} is outside this shear's ${fmtLength(shear.backgaugeMinMm, units)}–${fmtLength(shear.backgaugeMaxMm, units)} travel.`;
  return [
    finding(
      "backgauge_out_of_travel",
      `/cuts/${index}/backgauge`,
      message,
      showLength(bound, units),
      showLength(setting, units),
      units,
    ),
  ];
}

/**
 * Settings the machine cannot tell apart: a group set within the shear's
 * stated backgauge repeatability of an earlier group's setting, but not at
 * it. Groups of 0 strokes set no backgauge and are left out. One finding per
 * group, against the nearest such earlier setting.
 */
export function checkBackgaugeRepeatability(
  cuts: readonly FlowCut[],
  skip: readonly boolean[],
  shear: ShearProfile,
  units: LengthUnit,
): Finding[] {
  const repeatabilityMm = shear.backgaugeRepeatabilityMm;
  if (repeatabilityMm === undefined || !(repeatabilityMm > 0)) return [];
  const out: Finding[] = [];
  for (let later = 1; later < cuts.length; later++) {
    if (skip[later] || cuts[later].count === 0) continue;
    let nearest: { index: number; differenceMm: number } | null = null;
    for (let earlier = 0; earlier < later; earlier++) {
      if (skip[earlier] || cuts[earlier].count === 0) continue;
      const differenceMm = Math.abs(cuts[later].backgaugeMm - cuts[earlier].backgaugeMm);
      if (differenceMm <= SAME_SETTING_MM || differenceMm >= repeatabilityMm) continue;
      if (nearest === null || differenceMm < nearest.differenceMm) nearest = { index: earlier, differenceMm };
    }
    if (nearest === null) continue;
    const message =
      `${capital(groupName(later))} is set at ${fmtLength(cuts[later].backgaugeMm, units)}, only ${fmtLength(nearest.differenceMm, units)} from ${groupName(nearest.index)}'s ` +
      `${fmtLength(cuts[nearest.index].backgaugeMm, units)}: finer than this shear's ${fmtLength(repeatabilityMm, units)} backgauge repeatability, so the two may come out the same.`;
    out.push(
      finding(
        "backgauge_finer_than_repeatability",
        `/cuts/${later}/backgauge`,
        message,
        showLength(repeatabilityMm, units),
        showLength(nearest.differenceMm, units),
        units,
      ),
    );
  }
  return out;
}

/** Narrow strip (ours): width under 10 × thickness, or length over 50 × width. */
function checkNarrowStrip(
  cut: FlowCut,
  lengthMm: number,
  index: number,
  thicknessMm: number | null,
  units: LengthUnit,
): Finding[] {
  const minWidth = Math.max(
    thicknessMm === null ? 0 : NARROW_STRIP_WIDTH_PER_THICKNESS * thicknessMm,
    lengthMm / NARROW_STRIP_LENGTH_PER_WIDTH,
  );
  if (cut.backgaugeMm >= minWidth) return [];
  const of = thicknessMm === null ? "" : ` of ${fmtLength(thicknessMm, units)} material`;
  const message = `${capital(groupName(index))} cuts strips ${fmtLength(cut.backgaugeMm, units)} wide and ${fmtLength(lengthMm, units)} long${of}; strips narrower than ${fmtLength(minWidth, units)} tend to twist and bow.`;
  return [
    finding(
      "strip_narrow",
      `/cuts/${index}/backgauge`,
      message,
      showLength(minWidth, units),
      showLength(cut.backgaugeMm, units),
      units,
    ),
  ];
}

/** The width below which strips are likely to distort at a rake (ours: 20 × thickness × rake in degrees). */
export const distortionWidthMm = (thicknessMm: number, rakeDeg: number): number =>
  STRIP_DISTORTION_WIDTH_PER_THICKNESS_DEGREE * thicknessMm * rakeDeg;

/** Strips likely to twist, bow and camber at this rake; says what the shear's lowest rake would allow. */
function checkStripDistortion(
  cut: FlowCut,
  index: number,
  thicknessMm: number | null,
  rakeDeg: number | null,
  shear: ShearProfile | null,
  units: LengthUnit,
): Finding[] {
  if (thicknessMm === null || rakeDeg === null || !(rakeDeg > 0)) return [];
  const minWidth = distortionWidthMm(thicknessMm, rakeDeg);
  if (cut.backgaugeMm >= minWidth) return [];
  let lower = "";
  if (shear !== null && shear.rakeMinDeg < rakeDeg) {
    const atLowest = distortionWidthMm(thicknessMm, shear.rakeMinDeg);
    lower =
      cut.backgaugeMm >= atLowest
        ? ` At this shear's lowest rake (${shear.rakeMinDeg}°) the strip would be clear of the rule, if the force fits.`
        : ` Even at this shear's lowest rake (${shear.rakeMinDeg}°) strips under ${fmtLength(atLowest, units)} are at risk.`;
  }
  const message =
    `${capital(groupName(index))} cuts strips ${fmtLength(cut.backgaugeMm, units)} wide of ${fmtLength(thicknessMm, units)} material at ${rakeDeg}° rake: ` +
    `narrower than ${fmtLength(minWidth, units)} (20 × thickness × rake in degrees, our rule) they are likely to twist, bow and curve (camber); a lower rake reduces this at the cost of force.${lower}`;
  return [
    finding(
      "strip_distortion",
      `/cuts/${index}/backgauge`,
      message,
      showLength(minWidth, units),
      showLength(cut.backgaugeMm, units),
      units,
    ),
  ];
}
