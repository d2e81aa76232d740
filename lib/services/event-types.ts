/** Every event type Shearwire emits. */
export const EVENT_TYPES = [
  "program.created", "program.updated", "program.released", "program.claimed", "program.started",
  "program.progressed", "program.completed", "program.failed", "program.cancelled", "program.lease_expired",
  "plan.completed", "plan.failed", "plan.cancelled", "endpoint.test",
] as const;
export type EventType = (typeof EVENT_TYPES)[number];

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
  "endpoint.test": "A test event, sent only to the endpoint it was asked for.",
};
