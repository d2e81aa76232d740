import { GRADE_FAMILIES } from "../../../entities/Grade";
import { defineOperation } from "../operation";
import { GaugeQuerySchema, GaugeTableSchema, SetupRequestSchema } from "../../schemas/catalog";
import { idParam, listOf, PaginationSchema } from "../../schemas/common";
import { GradeSchema, GradeInputSchema, GradePatchSchema } from "../../schemas/grade";
import { CheckSchema } from "../../schemas/check";
import { ShearSchema, ShearInputSchema, ShearPatchSchema } from "../../schemas/shear";
import { z } from "../../schemas/zod";

const tags = ["Catalog"];
const archivedFlag = z.enum(["true", "false"]).optional().openapi({ description: "`true` includes archived entries" });

export const listShearsOperation = defineOperation({
  operationId: "listShears",
  method: "get",
  path: "/shears",
  tags,
  scope: "catalog:read",
  summary: "List shears",
  query: PaginationSchema.extend({
    includeArchived: archivedFlag,
    include_archived: archivedFlag.openapi({
      description: "The earlier spelling of `includeArchived`, still accepted",
      deprecated: true,
    }),
  }),
  responses: { 200: { description: "A page of shears.", schema: listOf(ShearSchema, "ShearList") } },
});
export const createShearOperation = defineOperation({
  operationId: "createShear",
  method: "post",
  path: "/shears",
  tags,
  scope: "catalog:write",
  summary: "Add a shear",
  body: ShearInputSchema,
  responses: { 201: { description: "Created.", schema: ShearSchema } },
});
export const getShearOperation = defineOperation({
  operationId: "getShear",
  method: "get",
  path: "/shears/{id}",
  tags,
  scope: "catalog:read",
  summary: "Read a shear",
  params: idParam("shr", "shear"),
  responses: { 200: { description: "The shear.", schema: ShearSchema } },
});
export const updateShearOperation = defineOperation({
  operationId: "updateShear",
  method: "patch",
  path: "/shears/{id}",
  tags,
  scope: "catalog:write",
  summary: "Change a shear",
  description:
    "Programs already released keep the check they were released with; drafts are checked against the new profile when next changed or released.",
  params: idParam("shr", "shear"),
  body: ShearPatchSchema,
  errors: [409],
  responses: { 200: { description: "The changed shear.", schema: ShearSchema } },
});
export const archiveShearOperation = defineOperation({
  operationId: "archiveShear",
  method: "post",
  path: "/shears/{id}/archive",
  tags,
  scope: "catalog:write",
  summary: "Archive a shear",
  description: "Archived shears take no new programs and are left out of lists unless asked for.",
  params: idParam("shr", "shear"),
  responses: { 200: { description: "The archived shear.", schema: ShearSchema } },
});

export const listGradesOperation = defineOperation({
  operationId: "listGrades",
  method: "get",
  path: "/grades",
  tags,
  scope: "catalog:read",
  summary: "List grades",
  query: PaginationSchema.extend({
    includeArchived: archivedFlag,
    include_archived: archivedFlag.openapi({
      description: "The earlier spelling of `includeArchived`, still accepted",
      deprecated: true,
    }),
    family: z.enum(GRADE_FAMILIES).optional(),
  }),
  responses: { 200: { description: "A page of grades.", schema: listOf(GradeSchema, "GradeList") } },
});
export const createGradeOperation = defineOperation({
  operationId: "createGrade",
  method: "post",
  path: "/grades",
  tags,
  scope: "catalog:write",
  summary: "Add a grade",
  body: GradeInputSchema,
  errors: [409],
  responses: { 201: { description: "Created.", schema: GradeSchema } },
});
export const getGradeOperation = defineOperation({
  operationId: "getGrade",
  method: "get",
  path: "/grades/{id}",
  tags,
  scope: "catalog:read",
  summary: "Read a grade",
  params: idParam("grd", "grade"),
  responses: { 200: { description: "The grade.", schema: GradeSchema } },
});
export const updateGradeOperation = defineOperation({
  operationId: "updateGrade",
  method: "patch",
  path: "/grades/{id}",
  tags,
  scope: "catalog:write",
  summary: "Change a grade",
  params: idParam("grd", "grade"),
  body: GradePatchSchema,
  responses: { 200: { description: "The changed grade.", schema: GradeSchema } },
});
export const archiveGradeOperation = defineOperation({
  operationId: "archiveGrade",
  method: "post",
  path: "/grades/{id}/archive",
  tags,
  scope: "catalog:write",
  summary: "Archive a grade",
  description: "Programs naming an archived grade get a `grade_unknown` finding.",
  params: idParam("grd", "grade"),
  responses: { 200: { description: "The archived grade.", schema: GradeSchema } },
});

export const listGaugesOperation = defineOperation({
  operationId: "listGauges",
  method: "get",
  path: "/gauges",
  tags,
  scope: "catalog:read",
  summary: "Gauge tables",
  description: "Gauge number to thickness for each gauge system, derived from each system's published definition.",
  query: GaugeQuerySchema,
  responses: {
    200: {
      description: "The gauge tables.",
      schema: z.object({ data: z.array(GaugeTableSchema) }).openapi("GaugeTables"),
    },
  },
});
export const recommendSetupOperation = defineOperation({
  operationId: "recommendSetup",
  method: "post",
  path: "/setup",
  tags,
  scope: "catalog:read",
  summary: "Setup for a grade, thickness and shear",
  description:
    "Blade gap (by material and thickness, with the gap at the ends and at the centre), rake, crown, hold-down and force for a full-length cut (or `length`), without a program. Each value says why. Recommendations for a qualified operator, never a guarantee: the machine's manual, its guarding, lockout and local codes come first.",
  body: SetupRequestSchema,
  responses: {
    200: {
      description: "The recommendation.",
      schema: z
        .object({
          thickness: CheckSchema.shape.thickness.unwrap(),
          setup: CheckSchema.shape.setup.unwrap(),
          force: CheckSchema.shape.force.unwrap(),
          findings: CheckSchema.shape.findings,
        })
        .openapi("SetupRecommendation"),
    },
  },
});

export const catalogOperations = [
  listShearsOperation,
  createShearOperation,
  getShearOperation,
  updateShearOperation,
  archiveShearOperation,
  listGradesOperation,
  createGradeOperation,
  getGradeOperation,
  updateGradeOperation,
  archiveGradeOperation,
  listGaugesOperation,
  recommendSetupOperation,
];
