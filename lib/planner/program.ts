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

export interface PieceIn {
  blank: number;
  /** along the strip (its length of cut direction on the sheet) */
  along: number;
  /** across the strip; at most the strip's height */
  tall: number;
  turned: boolean;
}

export interface StripIn {
  height: number;
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
  height: number;
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

interface Segment { along: number; tall: number; count: number }
/** Strips alike in height and in the sizes of their pieces: one rip group, crosscut alike. Which blank each piece is does not matter to the shear. */
interface Kind { height: number; count: number; segments: Segment[]; instances: PieceIn[][] }

function kindsOf(strips: StripIn[]): Kind[] {
  const kinds = new Map<string, Kind>();
  for (const s of strips) {
    const sorted = [...s.pieces].sort((a, b) => b.along - a.along || b.tall - a.tall || a.blank - b.blank || Number(a.turned) - Number(b.turned));
    const segments: Segment[] = [];
    for (const p of sorted) {
      const last = segments[segments.length - 1];
      if (last && last.along === p.along && last.tall === p.tall) last.count += 1;
      else segments.push({ along: p.along, tall: p.tall, count: 1 });
    }
    const key = `${s.height}|${segments.map((g) => `${g.along}x${g.tall}*${g.count}`).join(",")}`;
    const k = kinds.get(key);
    if (k) {
      k.count += 1;
      k.instances.push(sorted);
    } else kinds.set(key, { height: s.height, count: 1, segments, instances: [sorted] });
  }
  return [...kinds.values()];
}

/**
 * An order of groups (each `count` pieces of `size` cut off a workpiece `total` long) that the
 * remnant rule leaves alone: after a group's strokes, the workpiece left must not equal the
 * group's size (it would become one more piece), except after the last group when the pieces
 * fill the workpiece exactly (then it is the last piece, named without a stroke). Depth-first,
 * preferring the given order; null when no order works within the search budget.
 */
export function arrange<T extends { size: number; count: number }>(items: T[], total: number, tol: number, maxGauge = Infinity): T[] | null {
  const used = items.reduce((s, it) => s + it.size * it.count, 0);
  const exact = total - used <= tol;
  let budget = 5000;
  const taken = new Array<boolean>(items.length).fill(false);
  const order: T[] = [];
  const go = (left: number): boolean => {
    if (order.length === items.length) return true;
    if (--budget < 0) return false;
    const tried = new Set<string>();
    for (let i = 0; i < items.length; i++) {
      if (taken[i]) continue;
      const it = items[i];
      const key = `${it.size}|${it.count}`;
      if (tried.has(key)) continue; // the same size and count again gives the same remnants
      tried.add(key);
      const last = order.length === items.length - 1;
      const after = left - it.size * it.count;
      if (!(last && exact) && Math.abs(after - it.size) <= tol) continue;
      // Beyond the backgauge's reach only as the last piece, named as the remnant without a stroke.
      if (it.size > maxGauge && !(last && exact && it.count === 1)) continue;
      taken[i] = true;
      order.push(it);
      if (go(after)) return true;
      order.pop();
      taken[i] = false;
    }
    return false;
  };
  return go(total) ? order : null;
}

interface Layout {
  /** cut off the first edge before ripping: the trim asked for plus any lead-off that keeps the remnant rule happy */
  lead: number;
  kinds: (Kind & { lead: number })[];
}

function emit(sheet: { length: number; width: number }, trim: number, layout: Layout, tol: number, f: (v: number) => string): { cuts: PlanCut[]; strips: PlacedStrip[]; leftovers: Leftover[] } {
  const cuts: PlanCut[] = [];
  const strips: PlacedStrip[] = [];
  const leftovers: Leftover[] = [];
  const { lead, kinds } = layout;
  if (lead > 0) {
    cuts.push({ backgauge: lead, count: 1, scrap: true, note: lead > trim && trim > 0 ? `trim the first edge (${f(trim)}) and cut off ${f(lead - trim)} of the sheet's spare width` : lead === trim ? "trim the first edge" : `cut off ${f(lead)} of the sheet's spare width first` });
    leftovers.push({ x: 0, y: 0, length: sheet.length, width: lead, kind: lead > trim ? "sheet-end" : "trim" });
  }
  const usable = sheet.width - lead;
  const used = kinds.reduce((s, k) => s + k.height * k.count, 0);
  const exact = usable - used <= tol;
  const ripAt: number[] = [];
  kinds.forEach((k, i) => {
    ripAt.push(cuts.length);
    const last = i === kinds.length - 1;
    const remnant = last && exact;
    cuts.push({ backgauge: k.height, count: remnant ? k.count - 1 : k.count, note: `rip ${k.count} × ${f(k.height)} strip${k.count > 1 ? "s" : ""}${remnant ? " (the last is what is left)" : ""}` });
  });
  if (!exact) leftovers.push({ x: 0, y: lead + used, length: sheet.length, width: usable - used, kind: "sheet-end" });
  let y = lead;
  const trims: PlanCut[] = [];
  const trimSources: number[] = [];
  kinds.forEach((k, i) => {
    const alongUsed = k.segments.reduce((s, g) => s + g.along * g.count, 0);
    const full = sheet.length - k.lead - alongUsed <= tol;
    const turnFrom = (cut: PlanCut) => {
      cut.turn = true;
      if (ripAt[i] !== cuts.length - 1) cut.from = ripAt[i];
    };
    if (k.lead > 0) {
      const cut: PlanCut = { backgauge: k.lead, count: 1, scrap: true, note: `turn the ${f(k.height)} strips; cut off ${f(k.lead)} of their spare length first` };
      turnFrom(cut);
      cuts.push(cut);
    }
    k.segments.forEach((g, j) => {
      const last = j === k.segments.length - 1;
      const remnant = last && full;
      const cut: PlanCut = { backgauge: g.along, count: remnant ? g.count - 1 : g.count, note: `crosscut ${g.count} × ${f(g.along)}${remnant ? " (the last is what is left)" : ""}` };
      if (j === 0 && k.lead === 0) {
        turnFrom(cut);
        cut.note = `turn the ${f(k.height)} strips; ${cut.note}`;
      }
      if (g.tall < k.height) trimSources.push(cuts.length);
      cuts.push(cut);
    });
    for (const g of k.segments) {
      if (g.tall < k.height) trims.push({ backgauge: g.tall, count: 1, turn: true, note: `turn the ${f(g.along)} × ${f(k.height)} pieces; trim to ${f(g.tall)}` });
    }
    for (let n = 0; n < k.count; n++) {
      let x = 0;
      if (k.lead > 0) {
        leftovers.push({ x: 0, y, length: k.lead, width: k.height, kind: "strip-end" });
        x = k.lead;
      }
      const pieces: PlacedPiece[] = [];
      const mine = [...k.instances[n]]; // this strip's own blanks, handed out in cutting order
      for (const g of k.segments) {
        for (let c = 0; c < g.count; c++) {
          const own = mine.splice(mine.findIndex((pc) => pc.along === g.along && pc.tall === g.tall), 1)[0];
          pieces.push({ blank: own.blank, along: g.along, tall: g.tall, turned: own.turned, x, y });
          if (g.tall < k.height) leftovers.push({ x, y: y + g.tall, length: g.along, width: k.height - g.tall, kind: "piece-trim" });
          x += g.along;
        }
      }
      if (!full) leftovers.push({ x, y, length: sheet.length - x, width: k.height, kind: "strip-end" });
      strips.push({ y, height: k.height, pieces });
      y += k.height;
    }
  });
  trims.forEach((t, i) => {
    if (trimSources[i] !== cuts.length - 1) t.from = trimSources[i];
    cuts.push(t);
  });
  return { cuts, strips, leftovers };
}

/** Lead-off lengths to try: none, then the whole spare, then parts of it; the whole cut (with the trim) stays within the backgauge's travel. */
function leads(spare: number, fixedLead: number, gauge: { min: number; max: number }, tol: number): number[] {
  const out = [0];
  if (spare <= tol) return out;
  const low = Math.max(1, gauge.min - fixedLead);
  const cands = [spare, Math.floor(spare / 2), Math.floor(spare / 3), spare - 1, spare - 2, Math.floor((2 * spare) / 3), low, low + 1, gauge.max - fixedLead];
  for (const c of cands) {
    if (c >= low && c <= spare && fixedLead + c <= gauge.max && !out.includes(c)) out.push(c);
  }
  return out;
}

/** An order for the groups of one workpiece, with a lead-off when no order works without one. */
function arrangeWithLead<T extends { size: number; count: number }>(items: T[], total: number, fixedLead: number, gauge: { min: number; max: number }, tol: number): { order: T[]; lead: number } | null {
  const used = items.reduce((s, it) => s + it.size * it.count, 0);
  for (const extra of leads(total - fixedLead - used, fixedLead, gauge, tol)) {
    const lead = fixedLead + extra;
    if (lead > 0 && Math.abs(total - lead - lead) <= tol) continue; // the rest would become lead-off too
    const order = arrange(items, total - lead, tol, gauge.max);
    if (order) return { order, lead };
  }
  return null;
}

const sizeKey = (a: number, b: number) => (a <= b ? `${a}x${b}` : `${b}x${a}`);

/**
 * The cut program for one sheet pattern, checked against the shear core's piece flow.
 * `mmPerUnit` converts the grid to millimetres for that check; `minGauge` is the nearest
 * backgauge setting (a lead-off cut is never shorter).
 */
export function writePattern(
  sheet: { length: number; width: number },
  trim: number,
  strips: StripIn[],
  mmPerUnit: number,
  gauge: { min: number; max: number } = { min: 0, max: Infinity },
  show: (v: number) => string = String,
): WrittenPattern | null {
  if (!strips.length) return null;
  const tol = REMNANT_TOLERANCE_MM / mmPerUnit;
  const want = new Map<string, number>();
  for (const s of strips) for (const p of s.pieces) want.set(sizeKey(p.along, p.tall), (want.get(sizeKey(p.along, p.tall)) ?? 0) + 1);
  const base = kindsOf(strips).sort((a, b) => b.height - a.height || b.count - a.count);
  const layouts: Layout[] = [];
  for (const first of [base, [...base].reverse()]) {
    const rip = arrangeWithLead(first.map((k) => ({ k, size: k.height, count: k.count })), sheet.width, trim, gauge, tol);
    if (!rip) continue;
    const kinds: Layout["kinds"] = [];
    for (const { k } of rip.order) {
      const segs = arrangeWithLead(k.segments.map((g) => ({ g, size: g.along, count: g.count })), sheet.length, 0, gauge, tol);
      if (!segs) break;
      kinds.push({ ...k, lead: segs.lead, segments: segs.order.map((x) => x.g) });
    }
    if (kinds.length === rip.order.length) layouts.push({ lead: rip.lead, kinds });
  }
  for (const layout of layouts) {
    const written = emit(sheet, trim, layout, tol, show);
    // Every stroke is gauged within the travel (a trim the caller asked for is theirs, and reported).
    if (written.cuts.some((c, i) => c.count > 0 && c.backgauge > gauge.max && !(i === 0 && c.scrap && c.backgauge === trim))) continue;
    const mm = (v: number) => v * mmPerUnit;
    const flowCuts: FlowCut[] = written.cuts.map((c) => ({ backgaugeMm: mm(c.backgauge), count: c.count, lengthMm: null, turn: c.turn === true, from: c.from ?? null, scrap: c.scrap === true }));
    const flow = simulateFlow({ lengthMm: mm(sheet.length), widthMm: mm(sheet.width) }, flowCuts);
    if (flow.groups.some((g) => g.beyond !== null || g.workpieces === 0 || (g.strokes === 0 && g.pieces.length === 0))) continue;
    // Each blank the flow makes must be a wanted size, within the remnant tolerance (the last piece of an
    // exactly filled strip is what is left, up to 0.1 mm over), and the counts must agree.
    const left = new Map(want);
    let matches = true;
    for (const b of flow.blanks) {
      const [a, c] = [b.widthMm, b.lengthMm].sort((x, y) => x - y);
      const key = [...left.keys()].find((k) => {
        const [p, q] = k.split("x").map((v) => Number(v) * mmPerUnit);
        return Math.abs(p - a) <= REMNANT_TOLERANCE_MM + 1e-9 && Math.abs(q - c) <= REMNANT_TOLERANCE_MM + 1e-9 && (left.get(k) ?? 0) >= b.count;
      });
      if (key === undefined) {
        matches = false;
        break;
      }
      left.set(key, left.get(key)! - b.count);
    }
    if (!matches || [...left.values()].some((n) => n !== 0)) continue;
    return { ...written, strokes: flow.strokes, turns: flow.turnedPieces };
  }
  return null;
}
