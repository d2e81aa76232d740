import { defineOperation } from "../operation";
import { idParam, listOf, PaginationSchema } from "../../schemas/common";
import {
  CancelInputSchema,
  ProgramSchema,
  ProgramBatchSchema,
  ProgramBatchInputSchema,
  ProgramBatchResultsSchema,
  ProgramInputSchema,
  ProgramLayoutSchema,
  ProgramListQuerySchema,
  ProgramPatchSchema,
  ProgramValidationSchema,
  ReleaseInputSchema,
} from "../../schemas/program";

const tags = ["Programs"];
const params = idParam("prg", "program");
const etag = { ETag: { description: "The program's revision, for If-Match.", schema: { type: "string" as const } } };

export const createProgramOperation = defineOperation({
  operationId: "createProgram",
  method: "post",
  path: "/programs",
  tags,
  scope: "programs:write",
  summary: "Create a cut program",
  description:
    "Checks the program against its shear and grade and stores it as a `draft` with the findings, setup, yield and estimate. A program with findings of severity `error` is stored too, and cannot be released until fixed. A second program with the same `reference` answers 409 with the existing id. Without `shear`, the shop's active shears are checked and one chosen (`routing`); when none can cut it, 422 `no-shear-can-cut` with each shear's reason.",
  body: ProgramInputSchema,
  responses: {
    201: {
      description: "Created.",
      schema: ProgramSchema,
      headers: { ...etag, Location: { description: "The program's URL.", schema: { type: "string" } } },
    },
  },
});

export const createProgramBatchOperation = defineOperation({
  operationId: "createProgramBatch",
  heavy: true,
  method: "post",
  path: "/programs/batch",
  tags,
  scope: "programs:write",
  summary: "Create up to 100 cut programs at once",
  description:
    'Each program is read and checked exactly as `POST /programs` would, and every program the batch creates is written in one transaction with its `program.created` event. By default the batch is all or nothing: if any program cannot be created, nothing is stored and the answer is one problem (422 when a program is invalid, else 409) whose `errors` point into `/programs/{index}/…` and whose `failures` hold each program\'s own problem with its `index`. With `"atomic": false` every program that can be created is, and the answer is 207 with one result per program in order: the program, or the problem creating it alone would have answered. One `Idempotency-Key` covers the whole batch.',
  body: ProgramBatchInputSchema,
  responses: {
    201: { description: "Every program created (all or nothing).", schema: ProgramBatchSchema },
    207: {
      description: "With `atomic: false`: each program's result or problem, in order.",
      schema: ProgramBatchResultsSchema,
    },
  },
});

export const listProgramsOperation = defineOperation({
  operationId: "listPrograms",
  method: "get",
  path: "/programs",
  tags,
  scope: "programs:read",
  summary: "List cut programs",
  description: "Newest first.",
  query: PaginationSchema.extend(ProgramListQuerySchema.shape),
  responses: { 200: { description: "A page of programs.", schema: listOf(ProgramSchema, "ProgramList") } },
});

export const getProgramOperation = defineOperation({
  operationId: "getProgram",
  method: "get",
  path: "/programs/{id}",
  tags,
  scope: "programs:read",
  summary: "Read a cut program",
  params,
  responses: { 200: { description: "The program.", schema: ProgramSchema, headers: etag } },
});

export const getProgramLayoutOperation = defineOperation({
  operationId: "getProgramLayout",
  method: "get",
  path: "/programs/{id}/layout",
  tags,
  scope: "programs:read",
  summary: "Read one sheet of a program as it is cut",
  description:
    "Where every blank, scrap strip and offcut of one sheet lies and where each stroke cuts, placed from the same piece flow as the program's check and with the remnant tolerance it counted with, in the program's units: for drawing the sheet. Computed from the program's current revision when it is read; not part of the check.",
  params,
  responses: { 200: { description: "The sheet as cut.", schema: ProgramLayoutSchema, headers: etag } },
});

export const updateProgramOperation = defineOperation({
  operationId: "updateProgram",
  method: "patch",
  path: "/programs/{id}",
  tags,
  scope: "programs:write",
  summary: "Change a draft",
  description: "Only `draft` programs change. Send `If-Match` with the ETag you read; the program is checked again.",
  params,
  body: ProgramPatchSchema,
  ifMatch: true,
  errors: [409],
  responses: { 200: { description: "The changed program.", schema: ProgramSchema, headers: etag } },
});

export const validateProgramOperation = defineOperation({
  operationId: "validateProgram",
  method: "post",
  path: "/programs/validate",
  tags,
  scope: "programs:read",
  summary: "Check a program without storing it",
  description:
    "A dry run: the same check as create, nothing stored, no events. Without `shear`, every active shear of the shop is checked and `routing` says which can cut it, which would be chosen and why the others were not.",
  body: ProgramInputSchema,
  responses: { 200: { description: "The check.", schema: ProgramValidationSchema } },
});

export const releaseProgramOperation = defineOperation({
  operationId: "releaseProgram",
  method: "post",
  path: "/programs/{id}/release",
  tags,
  scope: "programs:release",
  summary: "Release a draft to the shear",
  description:
    "Checks the program again against the current catalog. Needs a `pass`, or a `warn` whose warning codes are all in `acknowledge`. Answers 409 with the findings otherwise.",
  params,
  body: ReleaseInputSchema,
  errors: [409],
  responses: { 200: { description: "The released program.", schema: ProgramSchema, headers: etag } },
});

export const cancelProgramOperation = defineOperation({
  operationId: "cancelProgram",
  method: "post",
  path: "/programs/{id}/cancel",
  tags,
  scope: "programs:write",
  summary: "Cancel a program",
  description: "From `draft`, `released`, `claimed` or `running`.",
  params,
  body: CancelInputSchema,
  errors: [409],
  responses: { 200: { description: "The cancelled program.", schema: ProgramSchema, headers: etag } },
});

export const programOperations = [
  createProgramOperation,
  createProgramBatchOperation,
  listProgramsOperation,
  getProgramOperation,
  getProgramLayoutOperation,
  updateProgramOperation,
  validateProgramOperation,
  releaseProgramOperation,
  cancelProgramOperation,
];
