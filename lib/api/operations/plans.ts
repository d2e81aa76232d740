import { defineOperation } from "../operation";
import { idParam, listOf, Pagination } from "../../schemas/common";
import { Plan, PlanInput, WriteProgramsInput, WrittenPrograms } from "../../schemas/plan";

const tags = ["Plans"];
const params = idParam("pln", "plan");

export const createPlan = defineOperation({
  operationId: "createPlan", method: "post", path: "/plans", tags, scope: "programs:write",
  summary: "Plan blanks onto sheets",
  description:
    "Lays the blanks out on the stock in two-stage patterns the shear can cut (strips ripped across the sheet, each turned and crosscut; a piece narrower than its strip trimmed by one more cut), within the shear's blade and backgauge travel, never making more than asked plus the over-production allowance. Each sheet pattern is written as a cut program and checked by the shear core; the plan is stored. Blanks that cannot be placed are `findings`, never dropped silently.",
  body: PlanInput,
  responses: { 201: { description: "The stored plan.", schema: Plan, headers: { Location: { description: "The plan's URL.", schema: { type: "string" } } } } },
});

export const listPlans = defineOperation({
  operationId: "listPlans", method: "get", path: "/plans", tags, scope: "programs:read",
  summary: "List plans", description: "Newest first.",
  query: Pagination,
  responses: { 200: { description: "A page of plans.", schema: listOf(Plan, "PlanList") } },
});

export const getPlan = defineOperation({
  operationId: "getPlan", method: "get", path: "/plans/{id}", tags, scope: "programs:read",
  summary: "Read a plan", params,
  responses: { 200: { description: "The plan.", schema: Plan } },
});

export const writePlanPrograms = defineOperation({
  operationId: "writePlanPrograms", method: "post", path: "/plans/{id}/programs", tags, scope: "programs:write",
  summary: "Write the plan's cut programs",
  description:
    "Creates one draft program per sheet pattern (`sheet.count` = the pattern's repeats) exactly as `POST /programs` would: checked, stored, with a `program.created` event each. All or nothing; once per plan (409 with the program ids after that). References are `<prefix>/A`, `/B`, …; a reference already in use answers 409 and nothing is written.",
  params, body: WriteProgramsInput, errors: [409],
  responses: { 201: { description: "The programs written.", schema: WrittenPrograms } },
});

export const planOperations = [createPlan, listPlans, getPlan, writePlanPrograms];
