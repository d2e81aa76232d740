/**
 * Writing one sheet pattern as a cut program: an optional trim of the first edge, the rip
 * groups (one per strip kind), then for each kind a turning group that takes that kind's
 * strips (`from`) and crosscuts them, then a third turning group for each piece narrower
 * than its strip (trimming it to width). Identical strips share one kind; a kind's pieces
 * are crosscut longest first. Where the pieces fill a sheet or a strip exactly, the last
 * group names the remnant as its piece with one stroke fewer (possibly 0).
 *
 * Every program written here is run through the shear core's piece flow (in millimetres,
 * with its remnant tolerance) and must make exactly the pattern's blanks with no stroke
 * wasted; when an order of groups collides with the remnant rule another order is tried,
 * and `null` says none worked. Pure: no I/O; integer dimensions (the planner's grid).
 */
import { REMNANT_TOLERANCE_MM, simulateFlow, type FlowCut } from "../shear/flow";
import { arrangeWithLead, leadStrokes } from "./group-order";
import type { Leftover, PieceIn, PlacedPiece, PlacedStrip, PlanCut, StripIn, WrittenPattern } from "./written";

type Gauge = { min: number; max: number };

interface Segment {
  length: number;
  width: number;
  count: number;
}
/** Strips alike in width and in the sizes of their pieces: one rip group, crosscut alike. Which blank each piece is does not matter to the shear. */
interface Kind {
  width: number;
  count: number;
  segments: Segment[];
  instances: PieceIn[][];
}

function kindsOf(strips: StripIn[]): Kind[] {
  const kinds = new Map<string, Kind>();
  for (const strip of strips) {
    const sorted = [...strip.pieces].sort(
      (a, b) => b.length - a.length || b.width - a.width || a.blank - b.blank || Number(a.turned) - Number(b.turned),
    );
    const segments: Segment[] = [];
    for (const piece of sorted) {
      const last = segments[segments.length - 1];
      if (last && last.length === piece.length && last.width === piece.width) last.count += 1;
      else segments.push({ length: piece.length, width: piece.width, count: 1 });
    }
    const key = `${strip.width}|${segments.map((segment) => `${segment.length}x${segment.width}*${segment.count}`).join(",")}`;
    const kind = kinds.get(key);
    if (kind) {
      kind.count += 1;
      kind.instances.push(sorted);
    } else kinds.set(key, { width: strip.width, count: 1, segments, instances: [sorted] });
  }
  return [...kinds.values()];
}

interface Layout {
  /** cut off the first edge before ripping: the trim asked for plus any lead-off that keeps the remnant rule happy */
  lead: number;
  kinds: (Kind & { lead: number })[];
}

/** No backgauge limit: a caller's trim is one cut, as asked (outside the travel it is reported, not split). */
const ONE_CUT: Gauge = { min: 0, max: Infinity };

/**
 * A lead-off's cut groups (scrap) and where each stroke's piece starts and how long it is: one stroke when
 * the backgauge reaches it, else the strokes `leadStrokes` gives (`arrangeWithLead` proposes no lead-off it cannot
 * split), the note saying how the spare is taken.
 */
function leadOff(
  lead: number,
  gauge: Gauge,
  note: string,
  show: (value: number) => string,
): { cuts: PlanCut[]; pieces: { at: number; size: number }[] } {
  const strokes = leadStrokes(lead, gauge) ?? [{ size: lead, count: 1 }];
  const total = strokes.reduce((sum, group) => sum + group.count, 0);
  const cuts: PlanCut[] = strokes.map((group, index) => ({
    backgauge: group.size,
    count: group.count,
    scrap: true,
    note:
      total === 1
        ? note
        : index === 0
          ? `${note}, in ${total} strokes (more than the backgauge reaches at once): ${group.count} × ${show(group.size)}`
          : `then ${group.count} × ${show(group.size)}${index === strokes.length - 1 ? ", the rest of that spare" : ""}`,
  }));
  const pieces: { at: number; size: number }[] = [];
  let at = 0;
  for (const group of strokes)
    for (let stroke = 0; stroke < group.count; stroke++, at += group.size) pieces.push({ at, size: group.size });
  return { cuts, pieces };
}

function emit(
  sheet: { length: number; width: number },
  trim: number,
  layout: Layout,
  tolerance: number,
  gauge: Gauge,
  show: (value: number) => string,
): { cuts: PlanCut[]; strips: PlacedStrip[]; leftovers: Leftover[] } {
  const cuts: PlanCut[] = [];
  const strips: PlacedStrip[] = [];
  const leftovers: Leftover[] = [];
  const { lead, kinds } = layout;
  if (lead > 0) {
    const note =
      lead > trim && trim > 0
        ? `trim the first edge (${show(trim)}) and cut off ${show(lead - trim)} of the sheet's spare width`
        : lead === trim
          ? "trim the first edge"
          : `cut off ${show(lead)} of the sheet's spare width first`;
    const off = leadOff(lead, lead === trim ? ONE_CUT : gauge, note, show);
    cuts.push(...off.cuts);
    for (const piece of off.pieces)
      leftovers.push({
        x: 0,
        y: piece.at,
        length: sheet.length,
        width: piece.size,
        kind: lead > trim ? "sheet-end" : "trim",
      });
  }
  const usable = sheet.width - lead;
  const used = kinds.reduce((sum, kind) => sum + kind.width * kind.count, 0);
  const exact = usable - used <= tolerance;
  const ripAt: number[] = [];
  kinds.forEach((kind, index) => {
    ripAt.push(cuts.length);
    const remnant = index === kinds.length - 1 && exact;
    const plural = kind.count > 1 ? "s" : "";
    cuts.push({
      backgauge: kind.width,
      count: remnant ? kind.count - 1 : kind.count,
      note: `rip ${kind.count} × ${show(kind.width)} strip${plural}${remnant ? " (the last is what is left)" : ""}`,
    });
  });
  if (!exact) leftovers.push({ x: 0, y: lead + used, length: sheet.length, width: usable - used, kind: "sheet-end" });
  let y = lead;
  const trims: PlanCut[] = [];
  const trimSources: number[] = [];
  kinds.forEach((kind, kindIndex) => {
    const lengthUsed = kind.segments.reduce((sum, segment) => sum + segment.length * segment.count, 0);
    const full = sheet.length - kind.lead - lengthUsed <= tolerance;
    const turnFrom = (cut: PlanCut) => {
      cut.turn = true;
      if (ripAt[kindIndex] !== cuts.length - 1) cut.from = ripAt[kindIndex];
    };
    const kindLead = leadOff(
      kind.lead,
      gauge,
      `turn the ${show(kind.width)} strips; cut off ${show(kind.lead)} of their spare length first`,
      show,
    );
    kindLead.cuts.forEach((cut, index) => {
      if (index === 0) turnFrom(cut);
      cuts.push(cut);
    });
    kind.segments.forEach((segment, segmentIndex) => {
      const remnant = segmentIndex === kind.segments.length - 1 && full;
      const cut: PlanCut = {
        backgauge: segment.length,
        count: remnant ? segment.count - 1 : segment.count,
        note: `crosscut ${segment.count} × ${show(segment.length)}${remnant ? " (the last is what is left)" : ""}`,
      };
      if (segmentIndex === 0 && kind.lead === 0) {
        turnFrom(cut);
        cut.note = `turn the ${show(kind.width)} strips; ${cut.note}`;
      }
      if (segment.width < kind.width) trimSources.push(cuts.length);
      cuts.push(cut);
    });
    for (const segment of kind.segments) {
      if (segment.width < kind.width)
        trims.push({
          backgauge: segment.width,
          count: 1,
          turn: true,
          note: `turn the ${show(segment.length)} × ${show(kind.width)} pieces; trim to ${show(segment.width)}`,
        });
    }
    for (let copy = 0; copy < kind.count; copy++) {
      for (const piece of kindLead.pieces)
        leftovers.push({ x: piece.at, y, length: piece.size, width: kind.width, kind: "strip-end" });
      let x = kind.lead;
      const pieces: PlacedPiece[] = [];
      const own = [...kind.instances[copy]]; // this strip's own blanks, handed out in cutting order
      for (const segment of kind.segments) {
        for (let piece = 0; piece < segment.count; piece++) {
          const blank = own.splice(
            own.findIndex((candidate) => candidate.length === segment.length && candidate.width === segment.width),
            1,
          )[0];
          pieces.push({ blank: blank.blank, length: segment.length, width: segment.width, turned: blank.turned, x, y });
          if (segment.width < kind.width)
            leftovers.push({
              x,
              y: y + segment.width,
              length: segment.length,
              width: kind.width - segment.width,
              kind: "piece-trim",
            });
          x += segment.length;
        }
      }
      if (!full) leftovers.push({ x, y, length: sheet.length - x, width: kind.width, kind: "strip-end" });
      strips.push({ y, width: kind.width, pieces });
      y += kind.width;
    }
  });
  trims.forEach((trimCut, index) => {
    if (trimSources[index] !== cuts.length - 1) trimCut.from = trimSources[index];
    cuts.push(trimCut);
  });
  return { cuts, strips, leftovers };
}

const sizeKey = (a: number, b: number) => (a <= b ? `${a}x${b}` : `${b}x${a}`);

/**
 * The cut program for one sheet pattern, checked against the shear core's piece flow.
 * `mmPerUnit` converts the grid to millimetres for that check; `gauge` is the backgauge's
 * travel (a lead-off cut is never shorter than its nearest setting).
 */
export function writePattern(
  sheet: { length: number; width: number },
  trim: number,
  strips: StripIn[],
  mmPerUnit: number,
  gauge: { min: number; max: number } = { min: 0, max: Infinity },
  show: (value: number) => string = String,
): WrittenPattern | null {
  if (!strips.length) return null;
  const tolerance = REMNANT_TOLERANCE_MM / mmPerUnit;
  const want = new Map<string, number>();
  for (const strip of strips)
    for (const piece of strip.pieces)
      want.set(sizeKey(piece.length, piece.width), (want.get(sizeKey(piece.length, piece.width)) ?? 0) + 1);
  const base = kindsOf(strips).sort((a, b) => b.width - a.width || b.count - a.count);
  const layouts: Layout[] = [];
  for (const first of [base, [...base].reverse()]) {
    const rip = arrangeWithLead(
      first.map((kind) => ({ kind, size: kind.width, count: kind.count })),
      sheet.width,
      trim,
      gauge,
      tolerance,
    );
    if (!rip) continue;
    const kinds: Layout["kinds"] = [];
    for (const { kind } of rip.order) {
      const crosscuts = arrangeWithLead(
        kind.segments.map((segment) => ({ segment, size: segment.length, count: segment.count })),
        sheet.length,
        0,
        gauge,
        tolerance,
      );
      if (!crosscuts) break;
      kinds.push({ ...kind, lead: crosscuts.lead, segments: crosscuts.order.map((entry) => entry.segment) });
    }
    if (kinds.length === rip.order.length) layouts.push({ lead: rip.lead, kinds });
  }
  for (const layout of layouts) {
    const written = emit(sheet, trim, layout, tolerance, gauge, show);
    // Every stroke is gauged within the travel (a trim the caller asked for is theirs, and reported).
    if (
      written.cuts.some(
        (cut, index) =>
          cut.count > 0 && cut.backgauge > gauge.max && !(index === 0 && cut.scrap && cut.backgauge === trim),
      )
    )
      continue;
    const mm = (value: number) => value * mmPerUnit;
    const flowCuts: FlowCut[] = written.cuts.map((cut) => ({
      backgaugeMm: mm(cut.backgauge),
      count: cut.count,
      lengthMm: null,
      turn: cut.turn === true,
      from: cut.from ?? null,
      scrap: cut.scrap === true,
    }));
    const flow = simulateFlow({ lengthMm: mm(sheet.length), widthMm: mm(sheet.width) }, flowCuts);
    if (
      flow.groups.some(
        (group) =>
          group.beyond !== null || group.workpieces === 0 || (group.strokes === 0 && group.pieces.length === 0),
      )
    )
      continue;
    // Each blank the flow makes must be a wanted size, within the remnant tolerance (the last piece of an
    // exactly filled strip is what is left, up to 0.1 mm over), and the counts must agree.
    const left = new Map(want);
    let matches = true;
    for (const made of flow.blanks) {
      const [short, long] = [made.widthMm, made.lengthMm].sort((a, b) => a - b);
      const key = [...left.keys()].find((candidate) => {
        const [shortWanted, longWanted] = candidate.split("x").map((value) => Number(value) * mmPerUnit);
        return (
          Math.abs(shortWanted - short) <= REMNANT_TOLERANCE_MM + 1e-9 &&
          Math.abs(longWanted - long) <= REMNANT_TOLERANCE_MM + 1e-9 &&
          (left.get(candidate) ?? 0) >= made.count
        );
      });
      if (key === undefined) {
        matches = false;
        break;
      }
      left.set(key, left.get(key)! - made.count);
    }
    if (!matches || [...left.values()].some((count) => count !== 0)) continue;
    return { ...written, strokes: flow.strokes, turns: flow.turnedPieces };
  }
  return null;
}
