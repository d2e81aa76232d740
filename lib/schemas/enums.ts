/** Enumerations shared by entities, schemas and the browser (no imports: safe in any bundle). */

/** A type guard for one of `list`'s values (a query string, a stored text). */
function isOneOf<T extends string>(list: readonly T[]) {
  return (value: unknown): value is T => (list as readonly unknown[]).includes(value);
}
export const GRADE_FAMILIES = [
  "carbon-steel",
  "hsla-steel",
  "stainless",
  "aluminium",
  "copper",
  "abrasion-resistant",
] as const;
/** A plan is a job: queued → running → complete | failed | cancelled. */
export const PLAN_STATUSES = ["queued", "running", "complete", "failed", "cancelled"] as const;
/** What the shear core made of a program: no findings that matter, warnings to acknowledge, or errors. */
export const VALIDATIONS = ["pass", "warn", "fail"] as const;
export const GAUGE_FAMILIES = ["msg", "galvanized", "ussg", "awg"] as const;
export const PROGRAM_STATUSES = [
  "draft",
  "released",
  "claimed",
  "running",
  "completed",
  "failed",
  "cancelled",
] as const;
export type ProgramStatus = (typeof PROGRAM_STATUSES)[number];
export const isProgramStatus = isOneOf(PROGRAM_STATUSES);
export const ROLES = ["owner", "admin", "developer", "viewer"] as const;
export type Role = (typeof ROLES)[number];
export const PLAN_OBJECTIVES = ["fewest_sheets", "least_waste", "fewest_strokes"] as const;
export const PLAN_OBJECTIVE_LABELS: Record<(typeof PLAN_OBJECTIVES)[number], string> = {
  fewest_sheets: "Fewest sheets",
  least_waste: "Least waste",
  fewest_strokes: "Fewest strokes and turns",
};

/**
 * How a program or plan that names no shear is given one: the shear that can cut it with the least
 * of its capacity used, or the one with the fewest released programs waiting.
 */
export const ROUTING_RULES = ["least_capacity", "shortest_queue"] as const;
export type RoutingRule = (typeof ROUTING_RULES)[number];

/** Material on the racks: a full sheet as bought, or a remnant kept from a cut sheet. */
export const STOCK_KINDS = ["sheet", "remnant"] as const;
export type StockKind = (typeof STOCK_KINDS)[number];
/** A reservation holds sheets for a program until they are cut (`consumed`) or given back (`released`). */
export const RESERVATION_STATUSES = ["open", "consumed", "released"] as const;

/** Every event type Shearwire emits. */
export const EVENT_TYPES = [
  "program.created",
  "program.updated",
  "program.released",
  "program.claimed",
  "program.started",
  "program.progressed",
  "program.completed",
  "program.failed",
  "program.cancelled",
  "program.lease_expired",
  "plan.completed",
  "plan.failed",
  "plan.cancelled",
  "stock.created",
  "stock.adjusted",
  "stock.archived",
  "stock.reserved",
  "stock.released",
  "stock.consumed",
  "stock.remnant_added",
  "endpoint.test",
] as const;
export type EventType = (typeof EVENT_TYPES)[number];
export const isEventType = isOneOf(EVENT_TYPES);

/** What each event says, in a sentence (the console and the reference's webhook descriptions use these). */
export const EVENT_TYPE_WORDS: Record<EventType, string> = {
  "program.created": "A cut program was stored (from the API, an upload or a plan), with its check.",
  "program.updated": "A draft program was changed and checked again.",
  "program.released": "A program was released: the gateway beside its shear may claim it.",
  "program.claimed": "A gateway claimed a released program under a lease.",
  "program.started": "The gateway started cutting the program.",
  "program.progressed": "The gateway reported progress: groups, strokes and pieces done.",
  "program.completed": "The run finished; good and scrapped pieces as the gateway reported them.",
  "program.failed": "The run stopped before the end, with the reason the gateway gave.",
  "program.cancelled": "The program was cancelled before it was completed.",
  "program.lease_expired": "A gateway stopped sending heartbeats; the program is released again for another claim.",
  "plan.completed": "A plan was computed: its sheets, patterns and figures (read the plan for its layout).",
  "plan.failed": "A plan could not be computed (a time or memory limit, or a lost worker), with the reason.",
  "plan.cancelled": "A plan was cancelled before it was computed.",
  "stock.created": "Material was added to the shop's stock: full sheets or a remnant.",
  "stock.adjusted": "A stock item's quantity was corrected by hand, with the reason.",
  "stock.archived": "A stock item was archived: no longer offered to plans or reservations.",
  "stock.reserved": "Sheets of a stock item were reserved, for a program or by hand.",
  "stock.released": "A reservation was given back (its program was cancelled, or it was released by hand).",
  "stock.consumed": "A run used reserved sheets: they are booked out of stock.",
  "stock.remnant_added": "A run left an offcut at least the shop's remnant size: it is booked in as a remnant.",
  "endpoint.test": "A test event, sent only to the endpoint it was asked for.",
};

/** What an API key may do. */
export const SCOPES = [
  "programs:read",
  "programs:write",
  "programs:release",
  "gateway",
  "catalog:read",
  "catalog:write",
  "events:read",
  "webhooks:write",
  "settings:write",
  "stock:read",
  "stock:write",
] as const;
export type Scope = (typeof SCOPES)[number];
