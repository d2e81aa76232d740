/**
 * How the console says things: a cut group by its number (as the findings do), a JSON pointer
 * into a program as the group and field it names, thicknesses, strengths, gauge systems.
 */
import { GAUGE_FAMILY_NAMES } from "@/lib/shear/gauges";

/** "Group 3" for the third cut group (`/cuts/2`). */
export const groupName = (index: number) => `Group ${index + 1}`;

const FIELD_WORDS: Record<string, string> = {
  backgauge: "backgauge",
  count: "strokes",
  length: "length of cut",
  turn: "turn",
  from: "takes from",
  scrap: "trim",
  note: "note",
};

/** A pointer into a cut program in words: `/cuts/2/backgauge` → "Group 3, backgauge"; `/sheet/width` → "sheet width". */
export function pointerInWords(pointer: string): string {
  if (!pointer || pointer === "/") return "the program";
  const parts = pointer.split("/").slice(1);
  if (parts[0] === "cuts" && /^\d+$/.test(parts[1] ?? "")) {
    const group = groupName(Number(parts[1]));
    return parts[2] ? `${group}, ${FIELD_WORDS[parts[2]] ?? parts[2]}` : group;
  }
  return parts.join(" ");
}

/** A thickness as sent, with the size it comes to when it was a gauge number. */
export function thicknessInWords(
  thickness: { value: number } | { gauge: number },
  units: string,
  resolved?: { value: number; unit: string; gaugeFamily: string | null } | null,
): string {
  if ("value" in thickness) return `${thickness.value} ${units}`;
  const family = resolved?.gaugeFamily
    ? ` ${GAUGE_FAMILY_NAMES[resolved.gaugeFamily as keyof typeof GAUGE_FAMILY_NAMES] ?? resolved.gaugeFamily}`
    : "";
  return `${thickness.gauge} gauge${family}${resolved ? ` (${resolved.value} ${resolved.unit})` : ""}`;
}

/** A strength in MPa at a sensible precision (strengths converted from ksi carry long decimals). */
export const mpa = (value: number) => `${value >= 100 ? Math.round(value) : Math.round(value * 10) / 10} MPa`;

/** What each gauge system is, for people who do not read gauge tables every day. */
export const GAUGE_SYSTEM_WORDS: Record<string, string> = {
  msg: "Manufacturers' Standard Gauge: uncoated steel sheet",
  galvanized: "Galvanized sheet gauge: zinc-coated steel sheet",
  ussg: "US Standard Gauge (1893): stainless sheet",
  awg: "American Wire Gauge (Brown & Sharpe): aluminium and copper sheet",
};

/** What a plan's sheet count is worth, from the bounds it states (the fields the plan's `summary` carries). */
export interface SheetBounds {
  lowerBoundSheets: number;
  provenFewest: boolean;
  bounds: { areaSheets: number; apartSheets: number | null };
}

/**
 * "provably the fewest" or "at least N needed", said only for two-stage cutting when the LP bound, which holds
 * for the two-stage patterns the planner writes and not for every way of cutting, is what proves it; nothing for
 * plans stored before bounds were reported (0).
 */
export function sheetsHint({ lowerBoundSheets, provenFewest, bounds }: SheetBounds): string | null {
  if (lowerBoundSheets <= 0) return null;
  const claim = provenFewest ? "provably the fewest" : `at least ${lowerBoundSheets} needed`;
  const anyCutting = Math.max(bounds.areaSheets, bounds.apartSheets ?? 0) >= lowerBoundSheets;
  return anyCutting ? claim : `${claim} in two-stage cuts`;
}
