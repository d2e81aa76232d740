/** Enumerations shared by entities, schemas and the browser (no imports: safe in any bundle). */
export const GRADE_FAMILIES = ["carbon-steel", "hsla-steel", "stainless", "aluminium", "copper", "abrasion-resistant"] as const;
export const GAUGE_FAMILIES = ["msg", "galvanized", "ussg", "awg"] as const;
export const PROGRAM_STATUSES = ["draft", "released", "claimed", "running", "completed", "failed", "cancelled"] as const;
export type ProgramStatus = (typeof PROGRAM_STATUSES)[number];
export const ROLES = ["owner", "admin", "developer", "viewer"] as const;
export type Role = (typeof ROLES)[number];
export const PLAN_OBJECTIVES = ["fewest_sheets", "least_waste", "fewest_strokes"] as const;
export const PLAN_OBJECTIVE_LABELS: Record<(typeof PLAN_OBJECTIVES)[number], string> = {
  fewest_sheets: "Fewest sheets",
  least_waste: "Least waste",
  fewest_strokes: "Fewest strokes and turns",
};
