import { defineOperation } from "../operation";
import { idParam, listOf, PaginationSchema } from "../../schemas/common";
import {
  PlanSchema,
  PlanInputSchema,
  PlanPreviewSchema,
  PlanSummarySchema,
  WriteProgramsInputSchema,
  WrittenProgramsSchema,
} from "../../schemas/plan";

const tags = ["Plans"];
const params = idParam("pln", "plan");
const location = { Location: { description: "The plan's URL.", schema: { type: "string" as const } } };
const LIMITS =
  "Limits, checked before anything is stored (each refusal is a 422 naming the limit, the value and the most allowed): at most 200 blank types, 20,000 pieces and 10 stock sizes; a sheet side of at most 60,000 steps of the grid the order's sizes lie on, and at most 10 times the shear's blade; and an estimated amount of work for one round of strip filling. A worker stops a plan after 60 s (`failed`, reason `time_limit`).";

export const createPlanOperation = defineOperation({
  operationId: "createPlan",
  method: "post",
  path: "/plans",
  tags,
  scope: "programs:write",
  summary: "Plan blanks onto sheets",
  description:
    "Stores the order as a `queued` plan and answers 202 at once with its URL; a planning worker lays the blanks out on the stock in two-stage patterns the shear can cut (strips ripped across the sheet, each turned and crosscut; a piece narrower than its strip trimmed by one more cut), within the shear's blade and backgauge travel, never making more than asked plus the over-production allowance, and checks each pattern's program with the shear core. Read the plan (`GET /plans/{id}`: `queued` → `running`, with progress → `complete` | `failed` | `cancelled`) or subscribe to `plan.completed` and `plan.failed`. Send `Prefer: wait=N` (RFC 7240, N up to 10 seconds) to hold the answer until the plan ends: a plan that ends in time answers 201 with `Preference-Applied`. " +
    LIMITS,
  body: PlanInputSchema,
  requestHeaders: [
    {
      name: "Prefer",
      description: "`wait=N` (RFC 7240): hold the answer up to N seconds (at most 10) for the plan to end.",
      schema: { type: "string", maxLength: 200 },
    },
  ],
  responses: {
    202: {
      description: "Queued (or still running when `Prefer: wait` ran out).",
      schema: PlanSchema,
      headers: location,
    },
    201: {
      description: "Planned within `Prefer: wait`.",
      schema: PlanSchema,
      headers: {
        ...location,
        "Preference-Applied": { description: "`wait=N`, when the wait was honoured.", schema: { type: "string" } },
      },
    },
  },
});

export const previewPlanOperation = defineOperation({
  operationId: "previewPlan",
  method: "post",
  path: "/plans/preview",
  tags,
  scope: "programs:read",
  summary: "Plan without storing anything",
  description:
    "Computes the plan on a planning worker while you wait and answers it, storing nothing: try an order before committing to it. The same limits as `POST /plans`; a preview must end within 20 s (else 422 `plan-failed`), and answers 503 when no worker is free to compute it. " +
    LIMITS,
  body: PlanInputSchema,
  errors: [503],
  responses: { 200: { description: "The plan, not stored.", schema: PlanPreviewSchema } },
});

export const listPlansOperation = defineOperation({
  operationId: "listPlans",
  method: "get",
  path: "/plans",
  tags,
  scope: "programs:read",
  summary: "List plans",
  description: "Newest first, as summaries: read a plan for its patterns.",
  query: PaginationSchema,
  responses: { 200: { description: "A page of plans.", schema: listOf(PlanSummarySchema, "PlanList") } },
});

export const getPlanOperation = defineOperation({
  operationId: "getPlan",
  method: "get",
  path: "/plans/{id}",
  tags,
  scope: "programs:read",
  summary: "Read a plan",
  description: "Its state and progress, and once `complete`, its patterns, demand, stock, offcuts and findings.",
  params,
  responses: { 200: { description: "The plan.", schema: PlanSchema } },
});

export const cancelPlanOperation = defineOperation({
  operationId: "cancelPlan",
  method: "post",
  path: "/plans/{id}/cancel",
  tags,
  scope: "programs:write",
  summary: "Cancel a plan",
  description:
    "Stops a `queued` or `running` plan (a worker computing it stops at once) and sends `plan.cancelled`. A plan that has ended answers 409 with its state.",
  params,
  errors: [409],
  responses: { 200: { description: "The cancelled plan.", schema: PlanSchema } },
});

export const writePlanProgramsOperation = defineOperation({
  operationId: "writePlanPrograms",
  heavy: true,
  method: "post",
  path: "/plans/{id}/programs",
  tags,
  scope: "programs:write",
  summary: "Write the plan's cut programs",
  description:
    "Creates one draft program per sheet pattern of a `complete` plan (`sheet.count` = the pattern's repeats) exactly as `POST /programs` would: checked, stored, with a `program.created` event each. All or nothing; once per plan (409 with the program ids after that; 409 too while the plan is not complete). References are `<prefix>/A`, `/B`, …; a reference already in use answers 409 and nothing is written.",
  params,
  body: WriteProgramsInputSchema,
  errors: [409],
  responses: { 201: { description: "The programs written.", schema: WrittenProgramsSchema } },
});

export const planOperations = [
  createPlanOperation,
  previewPlanOperation,
  listPlansOperation,
  getPlanOperation,
  cancelPlanOperation,
  writePlanProgramsOperation,
];
