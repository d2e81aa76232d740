/** Every event type Shearwire emits. */
export const EVENT_TYPES = [
  "program.created", "program.updated", "program.released", "program.claimed", "program.started",
  "program.progressed", "program.completed", "program.failed", "program.cancelled", "program.lease_expired",
  "plan.completed", "plan.failed", "plan.cancelled", "endpoint.test",
] as const;
export type EventType = (typeof EVENT_TYPES)[number];
