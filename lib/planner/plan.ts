/**
 * Planning demand onto stock sheets with two-stage patterns a shear can cut: rip strips
 * across the sheet, turn each strip and crosscut it into blanks (a piece narrower than its
 * strip is trimmed to width by a third, turned cut). Greedy by pattern: for every stock
 * size still on hand (presented either way round the blade allows), build candidate
 * patterns for what is still wanted (strips chosen by value per unit of height or by area,
 * each filled by a knapsack along the strip and capped by what is still wanted), score them
 * by the objective, repeat the best as often as the demand and the stock allow, and go
 * again. Every pattern is written as a cut program and run through the shear core's piece
 * flow before it is kept (`program.ts`). Never produces more than asked plus the
 * over-production allowance. Blanks that fit no sheet within the shear's limits are
 * reported, not dropped. Pure: no I/O; integer dimensions (the caller's grid).
 */
import { writePattern, type Leftover, type PlacedStrip, type PlanCut, type StripIn } from "./program";
import { bestTwoStagePattern } from "./two-stage";
import { REMNANT_TOLERANCE_MM } from "../shear/flow";

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
  show?: (v: number) => string;
  /** told after every sheet pattern is chosen (for a progress report; must not change anything) */
  onProgress?: (progress: PlanProgress) => void;
}

/** How far a plan has come: sheet patterns chosen and the pieces they place, of those wanted. */
export interface PlanProgress {
  patterns: number;
  piecesPlaced: number;
  piecesWanted: number;
}

/** "fewest_strokes" takes the patterns with fewest strokes and turns per blank among those within this much utilisation of the fullest. */
export const STROKES_UTILISATION_SLACK = 0.05;

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
  /** distance from the first edge and the strip's height (the rip's backgauge setting) */
  y: number;
  height: number;
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
}

interface Variant { blank: number; along: number; tall: number; turned: boolean }

/** Every way each blank may lie, largest first (the greedy top-up of a strip relies on the order). */
function variants(blanks: Blank[]): Variant[] {
  const out: Variant[] = [];
  blanks.forEach((b, i) => {
    out.push({ blank: i, along: b.length, tall: b.width, turned: false });
    if (b.canTurn && b.length !== b.width) out.push({ blank: i, along: b.width, tall: b.length, turned: true });
  });
  return out.sort((a, b) => b.along * b.tall - a.along * a.tall || a.blank - b.blank || Number(a.turned) - Number(b.turned));
}

/** A sheet as it meets the blade: what may go along and across it. */
interface Presented {
  stock: number;
  rotated: boolean;
  length: number;
  width: number;
  /** usable width after the trim */
  usable: number;
  /** variants that fit this way round within the shear's limits */
  vs: Variant[];
  /** tallest strip the shear can crosscut */
  maxHeight: number;
  /** the backgauge's reach: a piece trimmed to width by a third cut is gauged at its width */
  gaugeMax: number;
}

/**
 * Knapsack work, in table cells, that one plan may spend on tables for the exact set of blanks
 * still wanted; past it, a strip height reuses one table for every blank that fits it (capped
 * when the strip is filled, so a little less full) and the exact one-sheet pattern is no longer
 * tried. Keeps large orders (hundreds of blank types) to seconds; counted, so plans stay
 * reproducible.
 */
export const PLAN_WORK_BUDGET = 150_000_000;
/** Past this much work in all, strips are filled greedily, largest blank first: a plan of any size ends in seconds. */
export const PLAN_WORK_LIMIT = 2 * PLAN_WORK_BUDGET;

/** Unbounded knapsack tables, kept per strip length, height and set of blanks still wanted (they rarely change). */
interface Tables {
  map: Map<string, { items: Variant[]; pick: Int32Array }>;
  work: number;
}

/** Fill a strip of this length and height with what may still be placed: unbounded knapsack by area, then capped. */
function fillStrip(length: number, height: number, open: Variant[], all: () => Variant[], cap: number[], tables: Tables, setKey: string): Variant[] {
  if (!open.length) return [];
  if (tables.work > PLAN_WORK_LIMIT) return topUp([], length, open, cap, new Map());
  tables.work += length; // reading the table back
  let items = open;
  // `setKey` names the blanks still wanted and the strip rule: with the height, it fixes `open`.
  let key = `${length}|${height}|${setKey}`;
  if (!tables.map.has(key) && tables.work + length * items.length > PLAN_WORK_BUDGET) {
    items = all();
    key = `${length}|${height}|${setKey.split("|")[0]}|all`;
  }
  let table = tables.map.get(key);
  if (!table) {
    tables.work += length * items.length; // counted even past the budget, toward the limit
    // Items shortest first in flat arrays, so each capacity stops at the first item too long for it.
    const order = items.map((_, i) => i).sort((a, b) => items[a].along - items[b].along);
    const al = Int32Array.from(order, (i) => items[i].along);
    const val = Float64Array.from(order, (i) => items[i].along * items[i].tall);
    const n = order.length;
    const best = new Float64Array(length + 1);
    const pick = new Int32Array(length + 1).fill(-1);
    for (let c = 1; c <= length; c++) {
      let b = best[c - 1];
      let k = -1;
      for (let j = 0; j < n; j++) {
        const a = al[j];
        if (a > c) break;
        const v = best[c - a] + val[j];
        if (v > b || (v === b && k >= 0 && order[j] < order[k])) { // ties go to the larger blank (items come largest first)
          b = v;
          k = j;
        }
      }
      best[c] = b;
      if (k >= 0) pick[c] = order[k];
    }
    table = { items, pick };
    tables.map.set(key, table);
  }
  const pick = table.pick;
  const chosen: Variant[] = [];
  const used = new Map<number, number>();
  for (let c = length; c > 0; ) {
    const i = pick[c];
    if (i < 0) {
      c -= 1;
      continue;
    }
    const it = items[i];
    if ((used.get(it.blank) ?? 0) < cap[it.blank]) {
      chosen.push(it);
      used.set(it.blank, (used.get(it.blank) ?? 0) + 1);
    }
    c -= it.along;
  }
  // Capping may leave room: top it up greedily with the largest pieces still wanted.
  return topUp(chosen, length, open, cap, used);
}

/** Fill what room is left along a strip with the largest pieces still wanted. */
function topUp(chosen: Variant[], length: number, items: Variant[], cap: number[], used: Map<number, number>): Variant[] {
  let room = length - chosen.reduce((s, v) => s + v.along, 0);
  for (const it of items) { // variants are kept largest first
    while (it.along <= room && (used.get(it.blank) ?? 0) < cap[it.blank]) {
      chosen.push(it);
      used.set(it.blank, (used.get(it.blank) ?? 0) + 1);
      room -= it.along;
    }
  }
  return chosen;
}

type Rule = "density" | "area";

/**
 * Strips for one sheet given what may still be placed, added one at a time by `rule`: the
 * most blank area per unit of strip height, or the most area. `exact` keeps to pieces as
 * tall as their strip (no trimming cut).
 */
function buildStrips(p: Presented, cap: number[], rule: Rule, exact: boolean, tol: number, tables: Tables): StripIn[] {
  const want = [...cap];
  const strips: StripIn[] = [];
  let free = p.usable;
  for (;;) {
    const open = p.vs.filter((v) => v.tall <= free && want[v.blank] > 0);
    const setKey = `${p.stock}${p.rotated ? "r" : ""}${exact ? "e" : "t"}|${want.map((n) => (n > 0 ? 1 : 0)).join("")}`;
    const heights = [...new Set(open.map((v) => v.tall))].filter((h) => h <= p.maxHeight);
    let best: { height: number; pieces: Variant[]; area: number } | null = null;
    for (const h of heights) {
      // A piece narrower than its strip is trimmed by one more cut; its offcut must not be a piece itself.
      const fits = (v: Variant) => v.tall === h || (!exact && v.tall < h - tol && v.tall <= p.gaugeMax && Math.abs(h - 2 * v.tall) > tol);
      const pieces = fillStrip(p.length, h, open.filter(fits), () => p.vs.filter(fits), want, tables, setKey);
      const a = pieces.reduce((s, v) => s + v.along * v.tall, 0);
      const better = !best || (rule === "density" ? a / h > best.area / best.height : a > best.area);
      if (a > 0 && better) best = { height: h, pieces, area: a };
    }
    if (!best) break;
    strips.push({ height: best.height, pieces: best.pieces.map((v) => ({ blank: v.blank, along: v.along, tall: v.tall, turned: v.turned })) });
    for (const v of best.pieces) want[v.blank] -= 1;
    free -= best.height;
  }
  return strips;
}

const isReusable = (o: { length: number; width: number }, min: { length: number; width: number } | null | undefined) =>
  !!min && Math.min(o.length, o.width) >= Math.min(min.length, min.width) && Math.max(o.length, o.width) >= Math.max(min.length, min.width);

interface Candidate {
  p: Presented;
  strips: PlacedStrip[];
  offcuts: Offcut[];
  cuts: PlanCut[];
  strokes: number;
  turns: number;
  blanksArea: number;
  reusableArea: number;
  pieces: number;
  uses: Map<number, number>;
}

/** How the shear's limits and the sheets on hand shape where each blank can go. */
function present(stock: Stock[], vs: Variant[], o: PlanOptions): { ways: Presented[]; unusable: number[] } {
  const lim = o.limits ?? null;
  const trim = o.trim ?? 0;
  const tol = REMNANT_TOLERANCE_MM / (o.mmPerUnit ?? 1);
  const ways: Presented[] = [];
  const unusable: number[] = [];
  stock.forEach((s, i) => {
    // A square sheet turned is the same sheet, unless some blank must keep its grain: then strips across are another pattern.
    const turns = s.length === s.width && vs.every((v) => v.turned || vs.some((w) => w.blank === v.blank && w.turned)) ? [false] : [false, true];
    let any = false;
    for (const rotated of turns) {
      const length = rotated ? s.width : s.length;
      const width = rotated ? s.length : s.width;
      if (lim && length > lim.bladeLength) continue;
      if (width - trim <= tol) continue;
      any = true;
      // A strip taller than the backgauge reaches can still be the sheet's last (its remnant), and a piece
      // longer than that the last of its strip: the program writer places them so, or gives them up.
      const maxHeight = Math.min(width - trim, lim ? lim.bladeLength : Infinity);
      // Grain follows the sheet: on a sheet presented the other way round, every blank is presented the other way round too.
      const these = rotated ? vs.map((v) => ({ ...v, along: v.tall, tall: v.along })) : vs;
      const fits = these.filter(
        (v) => v.along <= length && v.tall <= maxHeight && (!lim || (v.along >= lim.backgaugeMin && v.tall >= lim.backgaugeMin)),
      );
      ways.push({ stock: i, rotated, length, width, usable: width - trim, vs: fits, maxHeight, gaugeMax: lim ? lim.backgaugeMax : Infinity });
    }
    if (!any) unusable.push(i);
  });
  return { ways, unusable };
}

function whyUnplaceable(b: Blank, o: PlanOptions): string {
  const lim = o.limits;
  const f = o.show ?? String;
  const dims = `${f(b.length)} × ${f(b.width)}`;
  if (lim && Math.min(b.length, b.width) < lim.backgaugeMin) return `${dims}: ${f(Math.min(b.length, b.width))} is narrower than the backgauge's nearest setting (${f(lim.backgaugeMin)})`;
  const turnNote = b.canTurn ? " even turned" : " (it may not be turned)";
  return `${dims} fits on none of the stock sheets within the shear's blade${turnNote}`;
}

/**
 * The best two-stage pattern for one sheet by exact dynamic programming (`two-stage.ts`), when
 * what may still be placed is too much for one sheet to run out of any blank: then the
 * unbounded optimum is also the best capped one. Null when a blank could run out.
 */
function exactPattern(p: Presented, cap: number[], tables: Tables): StripIn[] | null {
  const open = p.vs.filter((v) => cap[v.blank] > 0);
  if (!open.length) return null;
  const sheetArea = p.length * p.usable;
  if (open.some((v) => cap[v.blank] < Math.floor(sheetArea / (v.along * v.tall)))) return null;
  const work = new Set(open.map((v) => v.tall)).size * p.length * open.length + p.usable * open.length;
  if (tables.work + work > PLAN_WORK_BUDGET) return null;
  tables.work += work;
  const best = bestTwoStagePattern({ length: p.length, width: p.usable }, open.map((v) => ({ length: v.along, width: v.tall })), "length");
  const strips: StripIn[] = [];
  for (const st of best.strips.filter((x) => x.height <= p.maxHeight).sort((a, b) => b.height - a.height)) {
    const pieces = st.pieces.flatMap((x) => Array.from({ length: x.count }, () => ({ blank: open[x.index].blank, along: open[x.index].along, tall: open[x.index].tall, turned: open[x.index].turned })));
    for (let i = 0; i < st.count; i++) strips.push({ height: st.height, pieces: pieces.map((pc) => ({ ...pc })) });
  }
  return strips.length ? strips : null;
}

export function planBlanks(stock: Stock[], blanks: Blank[], options: PlanOptions = {}): Plan {
  const o = { objective: "fewest_sheets" as Objective, trim: 0, overProductionPct: 0, mmPerUnit: 1, ...options };
  const tol = REMNANT_TOLERANCE_MM / o.mmPerUnit; // the shear core's remnant tolerance, in grid units
  const vs = variants(blanks);
  const { ways, unusable } = present(stock, vs, o);
  const quantity = blanks.map((b) => Math.max(0, Math.floor(b.quantity)));
  const allowance = quantity.map((q) => Math.floor((q * o.overProductionPct) / 100));
  const produced = blanks.map(() => 0);
  const onHand = stock.map((s) => s.count);
  const unplaced: Unplaced[] = [];
  const placeable = blanks.map((_, i) => ways.some((w) => w.vs.some((v) => v.blank === i)));
  blanks.forEach((b, i) => {
    if (!placeable[i] && quantity[i] > 0) unplaced.push({ blank: i, quantity: quantity[i], kind: "unplaceable", reason: whyUnplaceable(b, o) });
  });
  const left = () => quantity.map((q, i) => (placeable[i] ? Math.max(0, q - produced[i]) : 0));
  const patterns: SheetPattern[] = [];
  const tables: Tables = { map: new Map(), work: 0 };
  const exacts = o.objective === "fewest_strokes" ? [false, true] : [false];
  const gauge = { min: o.limits?.backgaugeMin ?? 0, max: o.limits?.backgaugeMax ?? Infinity };

  for (;;) {
    const need = left();
    if (!need.some((n) => n > 0)) break;
    const cap = quantity.map((q, i) => (placeable[i] && (need[i] > 0 || allowance[i] > 0) ? Math.max(0, q + allowance[i] - produced[i]) : 0));
    const candidates: Candidate[] = [];
    const consider = (p: Presented, first: StripIn[]) => {
      let strips = first;
      // A pattern must serve what is still wanted, not only the allowance.
      if (!strips.some((s) => s.pieces.some((pc) => need[pc.blank] > 0))) return;
      let written = writePattern({ length: p.length, width: p.width }, o.trim, strips, o.mmPerUnit, gauge, o.show);
      // When no order of groups satisfies the remnant rule (two pieces that the shear cannot tell
      // apart, say), give up pieces from the end until the program makes exactly what it shows.
      while (!written && strips.length) {
        const last = strips[strips.length - 1];
        strips = last.pieces.length > 1 ? [...strips.slice(0, -1), { ...last, pieces: last.pieces.slice(0, -1) }] : strips.slice(0, -1);
        if (strips.length) written = writePattern({ length: p.length, width: p.width }, o.trim, strips, o.mmPerUnit, gauge, o.show);
      }
      if (!written || !strips.some((s) => s.pieces.some((pc) => need[pc.blank] > 0))) return;
      const offcuts = written.leftovers.map((l) => ({ ...l, reusable: l.kind !== "trim" && isReusable(l, o.reusable) }));
      const uses = new Map<number, number>();
      let blanksArea = 0;
      let pieces = 0;
      for (const st of written.strips) for (const pc of st.pieces) {
        uses.set(pc.blank, (uses.get(pc.blank) ?? 0) + 1);
        blanksArea += pc.along * pc.tall;
        pieces += 1;
      }
      const reusableArea = offcuts.filter((x) => x.reusable).reduce((s, x) => s + x.length * x.width, 0);
      candidates.push({ p, strips: written.strips, offcuts, cuts: written.cuts, strokes: written.strokes, turns: written.turns, blanksArea, reusableArea, pieces, uses });
    };
    for (const p of ways) {
      if (onHand[p.stock] !== null && onHand[p.stock]! <= 0) continue;
      for (const exact of exacts) {
        for (const rule of ["density", "area"] as const) consider(p, buildStrips(p, cap, rule, exact, tol, tables));
      }
      const dp = exactPattern(p, cap, tables);
      if (dp) consider(p, dp);
    }
    if (!candidates.length) break;
    const best = choose(candidates, o);
    let repeats = Infinity;
    let useful = 0;
    for (const [b, n] of best.uses) {
      repeats = Math.min(repeats, Math.floor(cap[b] / n));
      if (need[b] > 0) useful = Math.max(useful, Math.ceil(need[b] / n));
    }
    repeats = Math.min(repeats, useful);
    const have = onHand[best.p.stock];
    if (have !== null) repeats = Math.min(repeats, have);
    repeats = Math.max(1, repeats);
    for (const [b, n] of best.uses) produced[b] += n * repeats;
    if (have !== null) onHand[best.p.stock] = have - repeats;
    patterns.push({
      stock: best.p.stock,
      rotated: best.p.rotated,
      length: best.p.length,
      width: best.p.width,
      repeats,
      strips: best.strips.map((st) => ({
        y: st.y,
        height: st.height,
        pieces: st.pieces.map((pc) => ({ blank: pc.blank, x: pc.x, y: pc.y, length: pc.along, width: pc.tall, turned: pc.turned })),
      })),
      offcuts: best.offcuts,
      cuts: best.cuts,
      strokes: best.strokes,
      turns: best.turns,
      utilisation: best.blanksArea / (best.p.length * best.p.width),
    });
    o.onProgress?.({
      patterns: patterns.length,
      piecesPlaced: produced.reduce((s, n, i) => s + Math.min(n, quantity[i]), 0),
      piecesWanted: quantity.reduce((s, q, i) => s + (placeable[i] ? q : 0), 0),
    });
  }
  left().forEach((n, i) => {
    if (n <= 0) return;
    // Short of stock, or can the shear not cut even one of it from any sheet (a strip or piece its
    // backgauge cannot reach, with no spare to take off first)?
    const alone = ways.some((p) => p.vs.some((v) => v.blank === i && writePattern({ length: p.length, width: p.width }, o.trim, [{ height: v.tall, pieces: [{ blank: i, along: v.along, tall: v.tall, turned: v.turned }] }], o.mmPerUnit, gauge) !== null));
    unplaced.push(alone
      ? { blank: i, quantity: n, kind: "stock_short", reason: "not enough stock on hand" }
      : { blank: i, quantity: n, kind: "unplaceable", reason: `${(o.show ?? String)(blanks[i].length)} × ${(o.show ?? String)(blanks[i].width)} cannot be cut from any of the stock sheets within the backgauge's travel` });
  });
  let usedArea = 0;
  let stockArea = 0;
  let reusableArea = 0;
  const reusable = new Map<string, { length: number; width: number; count: number }>();
  for (const p of patterns) {
    stockArea += p.length * p.width * p.repeats;
    for (const st of p.strips) for (const pc of st.pieces) usedArea += pc.length * pc.width * p.repeats;
    for (const x of p.offcuts) {
      if (!x.reusable) continue;
      reusableArea += x.length * x.width * p.repeats;
      const [a, b] = x.length >= x.width ? [x.length, x.width] : [x.width, x.length];
      const r = reusable.get(`${a}x${b}`) ?? { length: a, width: b, count: 0 };
      r.count += p.repeats;
      reusable.set(`${a}x${b}`, r);
    }
  }
  return {
    patterns,
    sheetsUsed: patterns.reduce((s, p) => s + p.repeats, 0),
    produced,
    extra: produced.map((n, i) => Math.max(0, n - quantity[i])),
    unplaced,
    unusableStock: unusable,
    utilisation: stockArea ? usedArea / stockArea : 0,
    netUtilisation: stockArea - reusableArea > 0 ? usedArea / (stockArea - reusableArea) : 0,
    reusable: [...reusable.values()].sort((a, b) => b.length * b.width - a.length * a.width),
    strokes: patterns.reduce((s, p) => s + p.strokes * p.repeats, 0),
    turns: patterns.reduce((s, p) => s + p.turns * p.repeats, 0),
  };
}

/** The objective's pick among candidate patterns for the next sheets. */
function choose(cs: Candidate[], o: PlanOptions): Candidate {
  const area = (c: Candidate) => c.p.length * c.p.width;
  const fill = (c: Candidate) => (c.blanksArea + (o.offcutsAsStock ? c.reusableArea : 0)) / area(c);
  const by = (score: (c: Candidate) => number, tie: (c: Candidate) => number) =>
    cs.reduce((best, c) => (score(c) > score(best) + 1e-12 || (Math.abs(score(c) - score(best)) <= 1e-12 && tie(c) > tie(best)) ? c : best));
  switch (o.objective) {
    case "least_waste":
      return by(fill, (c) => c.blanksArea);
    case "fewest_strokes": {
      const top = Math.max(...cs.map(fill));
      const near = cs.filter((c) => fill(c) >= top - STROKES_UTILISATION_SLACK);
      return near.reduce((best, c) => {
        const h = (x: Candidate) => (x.strokes + x.turns) / x.pieces;
        return h(c) < h(best) - 1e-12 || (Math.abs(h(c) - h(best)) <= 1e-12 && fill(c) > fill(best)) ? c : best;
      });
    }
    default:
      return by((c) => c.blanksArea, fill);
  }
}

/** The simplest lower bound on sheets: total blank area over one sheet's area (one stock size). */
export function areaLowerBound(sheet: { length: number; width: number }, blanks: Blank[]): number {
  const area = blanks.reduce((s, b) => s + b.length * b.width * b.quantity, 0);
  return Math.ceil(area / (sheet.length * sheet.width));
}
