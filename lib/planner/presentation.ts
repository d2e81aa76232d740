/**
 * How sheets meet the blade and how blanks may lie on them: every stock size presented either
 * way round the shear allows (the blade must reach across it), every blank each way its grain
 * allows, and which of those fit within the blade and the backgauge's travel.
 */
import { REMNANT_TOLERANCE_MM } from "../shear/flow";
import type { Blank, PlanOptions, Stock } from "./types";

/** One way a blank may lie on a sheet as presented: `length` along the blade, `width` toward the backgauge. */
export interface Variant {
  blank: number;
  length: number;
  width: number;
  turned: boolean;
}

/** A sheet as it meets the blade: what may go along and across it. */
export interface Presentation {
  stock: number;
  rotated: boolean;
  length: number;
  width: number;
  /** width left for strips after the trim */
  usableWidth: number;
  /** variants that fit this way round within the shear's limits, largest first */
  variants: Variant[];
  /** widest strip the shear can crosscut (its blade) */
  maxStripWidth: number;
  /** the backgauge's reach: a piece trimmed to width by a third cut is gauged at its width */
  backgaugeMax: number;
}

/** Every way each blank may lie, largest first (the greedy top-up of a strip relies on the order). */
export function variantsOf(blanks: Blank[]): Variant[] {
  const out: Variant[] = [];
  blanks.forEach((blank, index) => {
    out.push({ blank: index, length: blank.length, width: blank.width, turned: false });
    if (blank.canTurn && blank.length !== blank.width)
      out.push({ blank: index, length: blank.width, width: blank.length, turned: true });
  });
  return out.sort(
    (a, b) => b.length * b.width - a.length * a.width || a.blank - b.blank || Number(a.turned) - Number(b.turned),
  );
}

/** How the shear's limits and the sheets on hand shape where each blank can go. */
export function present(
  stock: Stock[],
  variants: Variant[],
  options: PlanOptions,
): { presentations: Presentation[]; unusable: number[] } {
  const limits = options.limits ?? null;
  const trim = options.trim ?? 0;
  const tolerance = REMNANT_TOLERANCE_MM / (options.mmPerUnit ?? 1);
  const presentations: Presentation[] = [];
  const unusable: number[] = [];
  stock.forEach((sheet, index) => {
    // A square sheet turned is the same sheet, unless some blank must keep its grain: then strips across are another pattern.
    const square =
      sheet.length === sheet.width &&
      variants.every((v) => v.turned || variants.some((w) => w.blank === v.blank && w.turned));
    let any = false;
    for (const rotated of square ? [false] : [false, true]) {
      const length = rotated ? sheet.width : sheet.length;
      const width = rotated ? sheet.length : sheet.width;
      if (limits && length > limits.bladeLength) continue;
      if (width - trim <= tolerance) continue;
      any = true;
      // A strip wider than the backgauge reaches can still be the sheet's last (its remnant), and a piece
      // longer than that the last of its strip: the program writer places them so, or gives them up.
      const maxStripWidth = Math.min(width - trim, limits ? limits.bladeLength : Infinity);
      // Grain follows the sheet: on a sheet presented the other way round, every blank is presented the other way round too.
      const these = rotated ? variants.map((v) => ({ ...v, length: v.width, width: v.length })) : variants;
      const fitting = these.filter(
        (variant) =>
          variant.length <= length &&
          variant.width <= maxStripWidth &&
          (!limits || (variant.length >= limits.backgaugeMin && variant.width >= limits.backgaugeMin)),
      );
      presentations.push({
        stock: index,
        rotated,
        length,
        width,
        usableWidth: width - trim,
        variants: fitting,
        maxStripWidth,
        backgaugeMax: limits ? limits.backgaugeMax : Infinity,
      });
    }
    if (!any) unusable.push(index);
  });
  return { presentations, unusable };
}

export function whyUnplaceable(blank: Blank, options: PlanOptions): string {
  const limits = options.limits;
  const show = options.show ?? String;
  const size = `${show(blank.length)} × ${show(blank.width)}`;
  const narrow = Math.min(blank.length, blank.width);
  if (limits && narrow < limits.backgaugeMin)
    return `${size}: ${show(narrow)} is narrower than the backgauge's nearest setting (${show(limits.backgaugeMin)})`;
  const turnNote = blank.canTurn ? " even turned" : " (it may not be turned)";
  return `${size} fits on none of the stock sheets within the shear's blade${turnNote}`;
}

/** Is a leftover at least the reusable size, either way round? */
export const isReusable = (
  leftover: { length: number; width: number },
  least: { length: number; width: number } | null | undefined,
) =>
  !!least &&
  Math.min(leftover.length, leftover.width) >= Math.min(least.length, least.width) &&
  Math.max(leftover.length, leftover.width) >= Math.max(least.length, least.width);
