/**
 * The order in which a workpiece's groups are cut (strips off a sheet, pieces off a strip) so
 * that the piece flow's remnant rule makes exactly what the pattern shows: after a group's
 * strokes the workpiece left must not be the group's size (it would become one more piece),
 * and a group beyond the backgauge's reach can only be the last piece, named as the remnant.
 * When no order works, a lead-off takes spare off first: one stroke, or, when the spare is more
 * than the backgauge reaches, several (a piece beyond the reach is then what is left in front of
 * the blade once everything behind it is cut off).
 */

/** Strokes of one size, cut one after another. */
export interface Strokes {
  size: number;
  count: number;
}

/**
 * A lead-off as strokes within the backgauge's travel: one when it reaches; else as many at the
 * farthest setting as fit and then the rest, so the spare comes off in the largest pieces the
 * backgauge allows (kept offcuts are worth more large). A rest shorter than the nearest setting
 * takes what it lacks from the stroke before it. Null when no strokes within the travel add up to it.
 */
export function leadStrokes(lead: number, gauge: { min: number; max: number }): Strokes[] | null {
  if (lead <= 0) return [];
  if (lead <= gauge.max) return [{ size: lead, count: 1 }];
  const full = Math.floor(lead / gauge.max);
  const rest = lead - full * gauge.max;
  if (rest === 0) return [{ size: gauge.max, count: full }];
  if (rest >= gauge.min)
    return [
      { size: gauge.max, count: full },
      { size: rest, count: 1 },
    ];
  const shortened = gauge.max - (gauge.min - rest);
  if (shortened < gauge.min) return null;
  return [
    ...(full > 1 ? [{ size: gauge.max, count: full - 1 }] : []),
    { size: shortened, count: 1 },
    { size: gauge.min, count: 1 },
  ];
}

/**
 * An order of groups (each `count` pieces of `size` cut off a workpiece `total` long) that the
 * remnant rule leaves alone: after a group's strokes, the workpiece left must not equal the
 * group's size (it would become one more piece), except after the last group when the pieces
 * fill the workpiece exactly (then it is the last piece, named without a stroke). Depth-first,
 * preferring the given order; null when no order works within the search budget.
 */
export function arrange<T extends { size: number; count: number }>(
  items: T[],
  total: number,
  tolerance: number,
  maxGauge = Infinity,
): T[] | null {
  const used = items.reduce((sum, item) => sum + item.size * item.count, 0);
  const exact = total - used <= tolerance;
  let budget = 5000;
  const taken = new Array<boolean>(items.length).fill(false);
  const order: T[] = [];
  const search = (left: number): boolean => {
    if (order.length === items.length) return true;
    if (--budget < 0) return false;
    const tried = new Set<string>();
    for (let index = 0; index < items.length; index++) {
      if (taken[index]) continue;
      const item = items[index];
      const key = `${item.size}|${item.count}`;
      if (tried.has(key)) continue; // the same size and count again gives the same remnants
      tried.add(key);
      const last = order.length === items.length - 1;
      const after = left - item.size * item.count;
      if (!(last && exact) && Math.abs(after - item.size) <= tolerance) continue;
      // Beyond the backgauge's reach only as the last piece, named as the remnant without a stroke.
      if (item.size > maxGauge && !(last && exact && item.count === 1)) continue;
      taken[index] = true;
      order.push(item);
      if (search(after)) return true;
      order.pop();
      taken[index] = false;
    }
    return false;
  };
  return search(total) ? order : null;
}

/**
 * Lead-off lengths to try: none, then the whole spare, then parts of it, each (with the trim) one cut within the
 * backgauge's travel; last, the whole spare in several strokes when one cannot take it.
 */
function leads(spare: number, fixedLead: number, gauge: { min: number; max: number }, tolerance: number): number[] {
  const out = [0];
  if (spare <= tolerance) return out;
  const several = fixedLead + spare > gauge.max && leadStrokes(fixedLead + spare, gauge) !== null;
  const low = Math.max(1, gauge.min - fixedLead);
  const candidates = [
    spare,
    Math.floor(spare / 2),
    Math.floor(spare / 3),
    spare - 1,
    spare - 2,
    Math.floor((2 * spare) / 3),
    low,
    low + 1,
    gauge.max - fixedLead,
  ];
  for (const candidate of candidates) {
    if (candidate >= low && candidate <= spare && fixedLead + candidate <= gauge.max && !out.includes(candidate))
      out.push(candidate);
  }
  if (several) out.push(spare);
  return out;
}

/** An order for the groups of one workpiece, with a lead-off when no order works without one. */
export function arrangeWithLead<T extends { size: number; count: number }>(
  items: T[],
  total: number,
  fixedLead: number,
  gauge: { min: number; max: number },
  tolerance: number,
): { order: T[]; lead: number } | null {
  const used = items.reduce((sum, item) => sum + item.size * item.count, 0);
  for (const extra of leads(total - fixedLead - used, fixedLead, gauge, tolerance)) {
    const lead = fixedLead + extra;
    const last = leadStrokes(lead, gauge)?.at(-1)?.size ?? lead;
    if (lead > 0 && Math.abs(total - lead - last) <= tolerance) continue; // the rest would become lead-off too
    const order = arrange(items, total - lead, tolerance, gauge.max);
    if (order) return { order, lead };
  }
  return null;
}
