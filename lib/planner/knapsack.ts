/**
 * Filling one strip along its length: an unbounded knapsack by blank area over the strip's
 * length, capped afterwards by what is still wanted and topped up greedily. Tables are kept
 * per strip length, width and set of blanks still wanted, and the cells computed are counted
 * against the greedy's work budget (so plans stay reproducible).
 */
import type { Variant } from "./presentation";
import { PLAN_WORK_BUDGET, PLAN_WORK_LIMIT } from "./types";

/** Knapsack tables kept for reuse, and the cells spent so far. */
export interface StripTables {
  map: Map<string, { items: Variant[]; pick: Int32Array }>;
  work: number;
  /** the blanks that fit a strip width, per set of blanks still wanted (a few sets kept) */
  fitting: Map<string, Map<number, Variant[]>>;
}

export const newStripTables = (): StripTables => ({ map: new Map(), work: 0, fitting: new Map() });

/** Sets of blanks still wanted whose fitting lists are kept. */
const FITTING_SETS = 32;

/** The list `compute` gives for this set and width, kept for the next strip or pattern that asks (the same every time). */
export function fittingFor(tables: StripTables, setKey: string, width: number, compute: () => Variant[]): Variant[] {
  let byWidth = tables.fitting.get(setKey);
  if (!byWidth) {
    if (tables.fitting.size >= FITTING_SETS) tables.fitting.delete(tables.fitting.keys().next().value!);
    byWidth = new Map();
    tables.fitting.set(setKey, byWidth);
  }
  let list = byWidth.get(width);
  if (!list) {
    list = compute();
    byWidth.set(width, list);
  }
  return list;
}

/**
 * Fill a strip of this length and width with what may still be placed (`open`); `all` gives every
 * variant that fits the width, for the shared table used past the budget. `setKey` names the blanks
 * still wanted and the strip rule: with the width it fixes `open`.
 */
export function fillStrip(
  length: number,
  width: number,
  open: Variant[],
  all: () => Variant[],
  cap: number[],
  tables: StripTables,
  setKey: string,
): Variant[] {
  if (!open.length) return [];
  if (tables.work > PLAN_WORK_LIMIT) return topUp([], length, open, cap, new Map());
  tables.work += length; // reading the table back
  let items = open;
  let key = `${length}|${width}|${setKey}`;
  if (!tables.map.has(key) && tables.work + length * items.length > PLAN_WORK_BUDGET) {
    items = all();
    key = `${length}|${width}|${setKey.split("|")[0]}|all`;
  }
  let table = tables.map.get(key);
  if (!table) {
    tables.work += length * items.length; // counted even past the budget, toward the limit
    table = { items, pick: knapsackPicks(length, items) };
    tables.map.set(key, table);
  }
  const chosen: Variant[] = [];
  const used = new Map<number, number>();
  for (let capacity = length; capacity > 0;) {
    const pickIndex = table.pick[capacity];
    if (pickIndex < 0) {
      capacity -= 1;
      continue;
    }
    const item = items[pickIndex];
    if ((used.get(item.blank) ?? 0) < cap[item.blank]) {
      chosen.push(item);
      used.set(item.blank, (used.get(item.blank) ?? 0) + 1);
    }
    capacity -= item.length;
  }
  // Capping may leave room: top it up greedily with the largest pieces still wanted.
  return topUp(chosen, length, open, cap, used);
}

/** Unbounded knapsack by area along `length`: for every capacity, the item last added (-1: a unit left empty). */
function knapsackPicks(length: number, items: Variant[]): Int32Array {
  // Items shortest first in flat arrays, so each capacity stops at the first item too long for it.
  const order = items.map((_, index) => index).sort((a, b) => items[a].length - items[b].length);
  const lengths = Int32Array.from(order, (index) => items[index].length);
  const values = Float64Array.from(order, (index) => items[index].length * items[index].width);
  const count = order.length;
  const best = new Float64Array(length + 1);
  const pick = new Int32Array(length + 1).fill(-1);
  for (let capacity = 1; capacity <= length; capacity++) {
    let bestValue = best[capacity - 1];
    let bestItem = -1;
    for (let item = 0; item < count; item++) {
      const itemLength = lengths[item];
      if (itemLength > capacity) break;
      const value = best[capacity - itemLength] + values[item];
      // Ties go to the larger blank (items come largest first).
      if (value > bestValue || (value === bestValue && bestItem >= 0 && order[item] < order[bestItem])) {
        bestValue = value;
        bestItem = item;
      }
    }
    best[capacity] = bestValue;
    if (bestItem >= 0) pick[capacity] = order[bestItem];
  }
  return pick;
}

/** Fill what room is left along a strip with the largest pieces still wanted. */
export function topUp(
  chosen: Variant[],
  length: number,
  items: Variant[],
  cap: number[],
  used: Map<number, number>,
): Variant[] {
  let room = length - chosen.reduce((sum, variant) => sum + variant.length, 0);
  for (const item of items) {
    // variants are kept largest first
    while (item.length <= room && (used.get(item.blank) ?? 0) < cap[item.blank]) {
      chosen.push(item);
      used.set(item.blank, (used.get(item.blank) ?? 0) + 1);
      room -= item.length;
    }
  }
  return chosen;
}
