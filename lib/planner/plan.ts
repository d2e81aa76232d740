/**
 * Planning demand onto stock sheets with two-stage patterns a shear can cut: rip strips
 * across the sheet, turn each strip and crosscut it into blanks. Greedy by pattern: for
 * every stock size still on hand, build the fullest pattern that the remaining demand can
 * use (strips chosen by value per unit of height, each filled by a knapsack along the
 * strip and capped by what is still wanted), keep the fullest, repeat it as often as the
 * demand and the stock allow, and go again. Never produces more than asked. Blanks that
 * fit no sheet are reported, not dropped. Pure: no I/O; integer dimensions.
 */

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

export interface SheetPattern {
  stock: number;
  repeats: number;
  strips: StripPlan[];
  utilisation: number;
}

export interface Plan {
  patterns: SheetPattern[];
  sheetsUsed: number;
  /** pieces placed per blank, over all repeats */
  produced: number[];
  unplaced: { blank: number; quantity: number; reason: string }[];
  utilisation: number;
}

interface Variant { blank: number; along: number; tall: number; turned: boolean }

function variants(blanks: Blank[]): Variant[] {
  const out: Variant[] = [];
  blanks.forEach((b, i) => {
    out.push({ blank: i, along: b.length, tall: b.width, turned: false });
    if (b.canTurn && b.length !== b.width) out.push({ blank: i, along: b.width, tall: b.length, turned: true });
  });
  return out;
}

/** Unbounded knapsack tables, kept per strip length, height and set of blanks still wanted (they rarely change). */
type Tables = Map<string, { items: Variant[]; pick: Int32Array }>;

/** Fill a strip of this length and height with what is still wanted: unbounded knapsack by area, then capped. */
function fillStrip(length: number, height: number, vs: Variant[], left: number[], tables: Tables): Variant[] {
  const items = vs.filter((v) => v.tall <= height && v.along <= length && left[v.blank] > 0);
  if (!items.length) return [];
  const key = `${length}|${height}|${items.map((v) => `${v.blank}${v.turned ? "t" : ""}`).join(",")}`;
  let table = tables.get(key);
  if (!table) {
    const best = new Float64Array(length + 1);
    const pick = new Int32Array(length + 1).fill(-1);
    for (let c = 1; c <= length; c++) {
      best[c] = best[c - 1];
      for (let i = 0; i < items.length; i++) {
        const it = items[i];
        if (it.along <= c) {
          const v = best[c - it.along] + it.along * it.tall;
          if (v > best[c]) {
            best[c] = v;
            pick[c] = i;
          }
        }
      }
    }
    table = { items, pick };
    tables.set(key, table);
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
    if ((used.get(it.blank) ?? 0) < left[it.blank]) {
      chosen.push(it);
      used.set(it.blank, (used.get(it.blank) ?? 0) + 1);
    }
    c -= it.along;
  }
  // Capping may leave room: top it up greedily with the largest pieces still wanted.
  let room = length - chosen.reduce((s, v) => s + v.along, 0);
  for (const it of [...items].sort((a, b) => b.along * b.tall - a.along * a.tall)) {
    while (it.along <= room && (used.get(it.blank) ?? 0) < left[it.blank]) {
      chosen.push(it);
      used.set(it.blank, (used.get(it.blank) ?? 0) + 1);
      room -= it.along;
    }
  }
  return chosen;
}

/**
 * The fullest pattern for one sheet given what is still wanted. Strips are added one at a
 * time, chosen by `rule`: the most blank area per unit of strip height, or the most area.
 */
function buildPattern(stock: Stock, vs: Variant[], left: number[], rule: "density" | "area", tables: Tables): { strips: { height: number; pieces: Variant[] }[]; area: number } {
  const want = [...left];
  const strips: { height: number; pieces: Variant[] }[] = [];
  let free = stock.width;
  let area = 0;
  for (;;) {
    const heights = [...new Set(vs.filter((v) => v.tall <= free && v.along <= stock.length && want[v.blank] > 0).map((v) => v.tall))];
    let bestStrip: { height: number; pieces: Variant[]; area: number } | null = null;
    for (const h of heights) {
      const pieces = fillStrip(stock.length, h, vs, want, tables);
      const a = pieces.reduce((s, v) => s + v.along * v.tall, 0);
      const better = !bestStrip || (rule === "density" ? a / h > bestStrip.area / bestStrip.height : a > bestStrip.area);
      if (a > 0 && better) bestStrip = { height: h, pieces, area: a };
    }
    if (!bestStrip) break;
    strips.push({ height: bestStrip.height, pieces: bestStrip.pieces });
    for (const v of bestStrip.pieces) want[v.blank] -= 1;
    free -= bestStrip.height;
    area += bestStrip.area;
  }
  return { strips, area };
}

export function planBlanks(stock: Stock[], blanks: Blank[]): Plan {
  const vs = variants(blanks);
  const left = blanks.map((b) => Math.max(0, Math.floor(b.quantity)));
  const onHand = stock.map((s) => s.count);
  const unplaced: Plan["unplaced"] = [];
  blanks.forEach((b, i) => {
    const fits = stock.some((s) => vs.some((v) => v.blank === i && v.along <= s.length && v.tall <= s.width));
    if (!fits && left[i] > 0) {
      unplaced.push({ blank: i, quantity: left[i], reason: `${b.length} × ${b.width} fits on none of the stock sheets${b.canTurn ? " even turned" : ""}` });
      left[i] = 0;
    }
  });
  const patterns: SheetPattern[] = [];
  const tables: Tables = new Map();
  while (left.some((n) => n > 0)) {
    let best: { stock: number; strips: { height: number; pieces: Variant[] }[]; utilisation: number } | null = null;
    stock.forEach((s, si) => {
      if (onHand[si] !== null && onHand[si]! <= 0) return;
      for (const rule of ["density", "area"] as const) {
        const p = buildPattern(s, vs, left, rule, tables);
        const utilisation = p.area / (s.length * s.width);
        if (p.strips.length && (!best || utilisation > best.utilisation)) best = { stock: si, strips: p.strips, utilisation };
      }
    });
    if (!best) break;
    const chosen = best as { stock: number; strips: { height: number; pieces: Variant[] }[]; utilisation: number };
    const uses = new Map<number, number>();
    for (const st of chosen.strips) for (const v of st.pieces) uses.set(v.blank, (uses.get(v.blank) ?? 0) + 1);
    let repeats = Math.min(...[...uses].map(([b, n]) => Math.floor(left[b] / n)));
    const have = onHand[chosen.stock];
    if (have !== null) repeats = Math.min(repeats, have);
    repeats = Math.max(1, repeats);
    for (const [b, n] of uses) left[b] -= n * repeats;
    if (have !== null) onHand[chosen.stock] = have - repeats;
    let y = 0;
    const strips: StripPlan[] = chosen.strips.map((st) => {
      let x = 0;
      const pieces = st.pieces.map((v) => {
        const p = { blank: v.blank, x, y, length: v.along, width: v.tall, turned: v.turned };
        x += v.along;
        return p;
      });
      const plan = { y, height: st.height, pieces };
      y += st.height;
      return plan;
    });
    patterns.push({ stock: chosen.stock, repeats, strips, utilisation: chosen.utilisation });
  }
  left.forEach((n, i) => {
    if (n > 0) unplaced.push({ blank: i, quantity: n, reason: "not enough stock on hand" });
  });
  const produced = blanks.map(() => 0);
  let usedArea = 0;
  let stockArea = 0;
  for (const p of patterns) {
    stockArea += stock[p.stock].length * stock[p.stock].width * p.repeats;
    for (const st of p.strips) for (const pc of st.pieces) {
      produced[pc.blank] += p.repeats;
      usedArea += pc.length * pc.width * p.repeats;
    }
  }
  return {
    patterns,
    sheetsUsed: patterns.reduce((s, p) => s + p.repeats, 0),
    produced,
    unplaced,
    utilisation: stockArea ? usedArea / stockArea : 0,
  };
}

/** The simplest lower bound on sheets: total blank area over one sheet's area (one stock size). */
export function areaLowerBound(sheet: { length: number; width: number }, blanks: Blank[]): number {
  const area = blanks.reduce((s, b) => s + b.length * b.width * b.quantity, 0);
  return Math.ceil(area / (sheet.length * sheet.width));
}
