import { GRADE_FAMILIES } from "../../../entities/Grade";
import { defineOperation } from "../operation";
import { GaugeQuery, GaugeTable, SetupRequest } from "../../schemas/catalog";
import { idParam, listOf, Pagination } from "../../schemas/common";
import { Grade, GradeInput, GradePatch } from "../../schemas/grade";
import { Check } from "../../schemas/check";
import { Shear, ShearInput, ShearPatch } from "../../schemas/shear";
import { z } from "../../schemas/zod";

const tags = ["Catalog"];
const archivedFlag = z.enum(["true", "false"]).optional().openapi({ description: "`true` includes archived entries" });

export const listShears = defineOperation({
  operationId: "listShears",
  method: "get",
  path: "/shears",
  tags,
  scope: "catalog:read",
  summary: "List shears",
  query: Pagination.extend({
    includeArchived: archivedFlag,
    include_archived: archivedFlag.openapi({
      description: "The earlier spelling of `includeArchived`, still accepted",
      deprecated: true,
    }),
  }),
  responses: { 200: { description: "A page of shears.", schema: listOf(Shear, "ShearList") } },
});
export const createShear = defineOperation({
  operationId: "createShear",
  method: "post",
  path: "/shears",
  tags,
  scope: "catalog:write",
  summary: "Add a shear",
  body: ShearInput,
  responses: { 201: { description: "Created.", schema: Shear } },
});
export const getShear = defineOperation({
  operationId: "getShear",
  method: "get",
  path: "/shears/{id}",
  tags,
  scope: "catalog:read",
  summary: "Read a shear",
  params: idParam("shr", "shear"),
  responses: { 200: { description: "The shear.", schema: Shear } },
});
export const updateShear = defineOperation({
  operationId: "updateShear",
  method: "patch",
  path: "/shears/{id}",
  tags,
  scope: "catalog:write",
  summary: "Change a shear",
  description:
    "Programs already released keep the check they were released with; drafts are checked against the new profile when next changed or released.",
  params: idParam("shr", "shear"),
  body: ShearPatch,
  errors: [409],
  responses: { 200: { description: "The changed shear.", schema: Shear } },
});
export const archiveShear = defineOperation({
  operationId: "archiveShear",
  method: "post",
  path: "/shears/{id}/archive",
  tags,
  scope: "catalog:write",
  summary: "Archive a shear",
  description: "Archived shears take no new programs and are left out of lists unless asked for.",
  params: idParam("shr", "shear"),
  responses: { 200: { description: "The archived shear.", schema: Shear } },
});

export const listGrades = defineOperation({
  operationId: "listGrades",
  method: "get",
  path: "/grades",
  tags,
  scope: "catalog:read",
  summary: "List grades",
  query: Pagination.extend({
    includeArchived: archivedFlag,
    include_archived: archivedFlag.openapi({
      description: "The earlier spelling of `includeArchived`, still accepted",
      deprecated: true,
    }),
    family: z.enum(GRADE_FAMILIES).optional(),
  }),
  responses: { 200: { description: "A page of grades.", schema: listOf(Grade, "GradeList") } },
});
export const createGrade = defineOperation({
  operationId: "createGrade",
  method: "post",
  path: "/grades",
  tags,
  scope: "catalog:write",
  summary: "Add a grade",
  body: GradeInput,
  errors: [409],
  responses: { 201: { description: "Created.", schema: Grade } },
});
export const getGrade = defineOperation({
  operationId: "getGrade",
  method: "get",
  path: "/grades/{id}",
  tags,
  scope: "catalog:read",
  summary: "Read a grade",
  params: idParam("grd", "grade"),
  responses: { 200: { description: "The grade.", schema: Grade } },
});
export const updateGrade = defineOperation({
  operationId: "updateGrade",
  method: "patch",
  path: "/grades/{id}",
  tags,
  scope: "catalog:write",
  summary: "Change a grade",
  params: idParam("grd", "grade"),
  body: GradePatch,
  responses: { 200: { description: "The changed grade.", schema: Grade } },
});
export const archiveGrade = defineOperation({
  operationId: "archiveGrade",
  method: "post",
  path: "/grades/{id}/archive",
  tags,
  scope: "catalog:write",
  summary: "Archive a grade",
  description: "Programs naming an archived grade get a `grade_unknown` finding.",
  params: idParam("grd", "grade"),
  responses: { 200: { description: "The archived grade.", schema: Grade } },
});

export const listGauges = defineOperation({
  operationId: "listGauges",
  method: "get",
  path: "/gauges",
  tags,
  scope: "catalog:read",
  summary: "Gauge tables",
  description: "Gauge number to thickness for each gauge system, derived from each system's published definition.",
  query: GaugeQuery,
  responses: {
    200: { description: "The gauge tables.", schema: z.object({ data: z.array(GaugeTable) }).openapi("GaugeTables") },
  },
});
export const recommendSetup = defineOperation({
  operationId: "recommendSetup",
  method: "post",
  path: "/setup",
  tags,
  scope: "catalog:read",
  summary: "Setup for a grade, thickness and shear",
  description:
    "Blade gap (by material and thickness, with the gap at the ends and at the centre), rake, crown, hold-down and force for a full-length cut (or `length`), without a program. Each value says why. Recommendations for a qualified operator, never a guarantee: the machine's manual, its guarding, lockout and local codes come first.",
  body: SetupRequest,
  responses: {
    200: {
      description: "The recommendation.",
      schema: z
        .object({
          thickness: Check.shape.thickness.unwrap(),
          setup: Check.shape.setup.unwrap(),
          force: Check.shape.force.unwrap(),
          findings: Check.shape.findings,
        })
        .openapi("SetupRecommendation"),
    },
  },
});

export const catalogOperations = [
  listShears,
  createShear,
  getShear,
  updateShear,
  archiveShear,
  listGrades,
  createGrade,
  getGrade,
  updateGrade,
  archiveGrade,
  listGauges,
  recommendSetup,
];
