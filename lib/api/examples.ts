/**
 * Realistic examples for the API reference, computed rather than typed in: the demo shop's
 * first shear and the cut-program worked example, checked by the shear core itself, and one
 * example delivery of every event type. Ids and times are fixed so the committed document
 * stays the same from build to build.
 */
import { DEMO_SHEARS } from "../schemas/shear";
import type { EventType } from "../schemas/enums";
import type { EventData } from "../schemas/events";
import type { PlanSummaryT } from "../schemas/plan";
import { EXAMPLE_PROGRAM, type ProgramLayoutT, type ProgramT } from "../schemas/program";
import { type CheckT } from "../schemas/check";
import type { ShearT } from "../schemas/shear";
import type { StockItemT, StockReservationT } from "../schemas/stock";
import { checkProgram, findGrade, programLayout, remnantToleranceMm } from "../shear";

const AT = "2026-12-08T09:30:00.000Z";
export const EXAMPLE_IDS = {
  shear: "shr_01JDEMO0BAY1SHEAR00000000",
  program: "prg_01JDEMOSIDEPANELS4000000000",
  plan: "pln_01JDEMOWEEK49A36000000000",
  endpoint: "whe_01JDEMOERPRECEIVER0000000",
  gatewayKey: "key_01JDEMOBAY1GATEWAY0000000",
  stockItem: "stk_01JDEMORACKB2A36SHEETS0000",
  reservation: "srv_01JDEMOSIDEPANELS40000000",
  remnant: "stk_01JDEMOREMNANTSIDEPANELS00",
} as const;

/** An invented rack of 3 mm A36 sheets, for the stock events' examples. */
function exampleStockItem(reserved: number): StockItemT {
  return {
    id: EXAMPLE_IDS.stockItem,
    kind: "sheet",
    grade: "A36",
    thicknessMm: 3,
    lengthMm: 2500,
    widthMm: 1250,
    quantity: 12,
    reserved,
    available: 12 - reserved,
    location: "Rack B2",
    note: null,
    sourceProgram: null,
    sourceRun: null,
    archivedAt: null,
    createdAt: AT,
    updatedAt: AT,
  };
}

const exampleRemnant = (): StockItemT => ({
  ...exampleStockItem(0),
  ...{ id: EXAMPLE_IDS.remnant, kind: "remnant", lengthMm: 2500, widthMm: 304.8, quantity: 2, available: 2 },
});

function exampleReservation(status: StockReservationT["status"]): StockReservationT {
  return {
    id: EXAMPLE_IDS.reservation,
    item: EXAMPLE_IDS.stockItem,
    quantity: 2,
    status,
    program: EXAMPLE_IDS.program,
    note: null,
    createdAt: AT,
    closedAt: status === "open" ? null : AT,
  };
}

export function exampleShear(): ShearT {
  const demo = DEMO_SHEARS[0] as Omit<
    ShearT,
    | "id"
    | "archivedAt"
    | "createdAt"
    | "updatedAt"
    | "description"
    | "maxBladeHardnessHb"
    | "crownAtRatedMm"
    | "crownBaselineMm"
    | "backgaugeRepeatabilityMm"
  > &
    Partial<
      Pick<
        ShearT,
        "description" | "maxBladeHardnessHb" | "crownAtRatedMm" | "crownBaselineMm" | "backgaugeRepeatabilityMm"
      >
    >;
  return {
    id: EXAMPLE_IDS.shear,
    ...demo,
    description: demo.description ?? null,
    maxBladeHardnessHb: demo.maxBladeHardnessHb ?? null,
    gradeThicknessLimitsMm: demo.gradeThicknessLimitsMm ?? {},
    crownAtRatedMm: demo.crownAtRatedMm ?? null,
    crownBaselineMm: demo.crownBaselineMm ?? null,
    backgaugeRepeatabilityMm: demo.backgaugeRepeatabilityMm ?? null,
    archivedAt: null,
    createdAt: AT,
    updatedAt: AT,
  };
}

/** One sheet of the worked example as it is cut, placed by the shear core on the demo shear. */
export function exampleProgramLayout(): ProgramLayoutT {
  return {
    id: EXAMPLE_IDS.program,
    revision: 1,
    layout: programLayout(EXAMPLE_PROGRAM, remnantToleranceMm(exampleShear())),
  };
}

/** The worked example, stored: its check is the shear core's own answer for the demo shear and A36. */
export function exampleProgram(): ProgramT {
  const shear = exampleShear();
  const { archivedAt: _a, createdAt: _c, updatedAt: _u, description: _d, ...profile } = shear;
  const check = checkProgram(
    { ...EXAMPLE_PROGRAM, shear: shear.id },
    {
      shear: {
        ...profile,
        crownAtRatedMm: profile.crownAtRatedMm ?? undefined,
        crownBaselineMm: profile.crownBaselineMm ?? undefined,
        backgaugeRepeatabilityMm: profile.backgaugeRepeatabilityMm ?? undefined,
      },
      grade: findGrade("A36"),
    },
  ) satisfies CheckT;
  return {
    id: EXAMPLE_IDS.program,
    status: "draft",
    revision: 1,
    reference: EXAMPLE_PROGRAM.reference,
    title: EXAMPLE_PROGRAM.title ?? null,
    routing: null,
    shear: shear.id,
    grade: EXAMPLE_PROGRAM.grade,
    thickness: EXAMPLE_PROGRAM.thickness,
    units: EXAMPLE_PROGRAM.units,
    sheet: EXAMPLE_PROGRAM.sheet,
    cuts: EXAMPLE_PROGRAM.cuts,
    setup: EXAMPLE_PROGRAM.setup,
    priority: EXAMPLE_PROGRAM.priority ?? 5,
    dueAt: EXAMPLE_PROGRAM.dueAt ?? null,
    metadata: EXAMPLE_PROGRAM.metadata ?? {},
    validation: check.validation,
    check,
    acknowledged: [],
    releasedAt: null,
    cancelledAt: null,
    run: {
      claimedBy: null,
      claimedAt: null,
      leaseExpiresAt: null,
      leaseExpiries: 0,
      startedAt: null,
      finishedAt: null,
      progress: null,
      outcome: null,
    },
    createdAt: AT,
    updatedAt: AT,
  };
}

function examplePlanSummary(status: "complete" | "failed" | "cancelled"): PlanSummaryT {
  return {
    id: EXAMPLE_IDS.plan,
    status,
    reference: "WK49-A36-10GA",
    title: "Week 49, 10 ga A36",
    shear: EXAMPLE_IDS.shear,
    routing: null,
    grade: "A36",
    thickness: { gauge: 10 },
    units: "in",
    progress: status === "cancelled" ? null : { patterns: 2, piecesPlaced: 96, piecesWanted: 96 },
    failure:
      status === "failed"
        ? {
            reason: "time_limit",
            message:
              "The plan took longer than this install's limit of 60 s and was stopped. Plan fewer blank types or pieces at once, or coarser sizes.",
          }
        : null,
    attempts: status === "cancelled" ? 0 : 1,
    programs: [],
    createdAt: AT,
    startedAt: status === "cancelled" ? null : AT,
    finishedAt: AT,
    coverage: status === "complete" ? "complete" : null,
    summary:
      status === "complete"
        ? {
            sheets: 2,
            patterns: 2,
            blanksAsked: 96,
            blanksPlanned: 96,
            extra: 0,
            short: 0,
            utilisationPct: 91.7,
            netUtilisationPct: 91.7,
            strokes: 84,
            turns: 16,
            estimateSeconds: 402.5,
            lowerBoundSheets: 2,
            provenFewest: true,
            bounds: { areaSheets: 2, apartSheets: 1, lpSheets: null },
            method: "greedy",
            methodNote: null,
          }
        : null,
  };
}

/** One delivery of each event type, as a receiver gets it. */
export function exampleWebhook(type: EventType): { type: EventType; timestamp: string; data: EventData<EventType> } {
  const draft = exampleProgram();
  const at = (status: ProgramT["status"], run: Partial<ProgramT["run"]> = {}): ProgramT => ({
    ...draft,
    status,
    revision: draft.revision + 1,
    releasedAt: status === "draft" ? null : AT,
    run: { ...draft.run, ...run },
  });
  const claimed = { claimedBy: EXAMPLE_IDS.gatewayKey, claimedAt: AT, leaseExpiresAt: "2026-12-08T09:31:00.000Z" };
  const data: { [T in EventType]: EventData<T> } = {
    "program.created": { program: draft },
    "program.updated": {
      program: { ...draft, revision: 2, title: "Side panels, lot 4 (revised)" },
      changed: ["title"],
    },
    "program.released": { program: at("released"), from: "draft" },
    "program.claimed": { program: at("claimed", claimed), from: "released", gateway: EXAMPLE_IDS.gatewayKey },
    "program.started": { program: at("running", { ...claimed, startedAt: AT }), from: "claimed" },
    "program.progressed": {
      program: at("running", { ...claimed, startedAt: AT, progress: { groupsDone: 2, strokesDone: 31 } }),
      from: "running",
      progress: { groupsDone: 2, strokesDone: 31 },
    },
    "program.completed": {
      program: at("completed", {
        ...claimed,
        leaseExpiresAt: null,
        startedAt: AT,
        finishedAt: AT,
        outcome: { result: "completed", goodPieces: 56, scrappedPieces: 0, sheetsUsed: 2 },
      }),
      from: "running",
      outcome: { goodPieces: 56, scrappedPieces: 0, sheetsUsed: 2 },
    },
    "program.failed": {
      program: at("failed", {
        ...claimed,
        leaseExpiresAt: null,
        startedAt: AT,
        finishedAt: AT,
        outcome: {
          result: "failed",
          reason: "light_curtain",
          message: "Light curtain broken at stroke 12; the operator stopped the run.",
        },
      }),
      from: "running",
      outcome: { reason: "light_curtain", message: "Light curtain broken at stroke 12; the operator stopped the run." },
    },
    "program.cancelled": {
      program: { ...at("cancelled"), cancelledAt: AT },
      from: "released",
      reason: "The order was withdrawn by the customer.",
    },
    "program.lease_expired": {
      program: at("released", { leaseExpiries: 1 }),
      from: "running",
      gateway: EXAMPLE_IDS.gatewayKey,
      reason: `No heartbeat from gateway key ${EXAMPLE_IDS.gatewayKey} before the lease ran out at 2026-12-08T09:31:00.000Z; the program is released again.`,
    },
    "plan.completed": { plan: examplePlanSummary("complete") },
    "plan.failed": { plan: examplePlanSummary("failed") },
    "plan.cancelled": { plan: examplePlanSummary("cancelled") },
    "stock.created": { item: exampleStockItem(0) },
    "stock.adjusted": { item: exampleStockItem(0), delta: -1, reason: "One sheet dented in handling." },
    "stock.archived": { item: { ...exampleStockItem(0), quantity: 0, available: 0, archivedAt: AT } },
    "stock.reserved": { item: exampleStockItem(2), reservation: exampleReservation("open") },
    "stock.released": {
      item: exampleStockItem(0),
      reservation: exampleReservation("released"),
      reason: `program ${EXAMPLE_IDS.program} was cancelled`,
    },
    "stock.consumed": {
      item: { ...exampleStockItem(0), quantity: 10 },
      reservation: exampleReservation("consumed"),
      program: EXAMPLE_IDS.program,
      sheets: 2,
    },
    "stock.remnant_added": {
      item: { ...exampleRemnant(), sourceProgram: EXAMPLE_IDS.program },
      program: EXAMPLE_IDS.program,
    },
    "endpoint.test": {
      endpoint: { id: EXAMPLE_IDS.endpoint, url: "https://erp.example/hooks/shearwire" },
      message: "A test event from Shearwire. If you can read this, your receiver works.",
    },
  };
  return { type, timestamp: AT, data: data[type] };
}
