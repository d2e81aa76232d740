import { defineOperation } from "../operation";
import { idParam } from "../../schemas/common";
import {
  ClaimSchema,
  ClaimRequestSchema,
  CompletionReportSchema,
  FailureReportSchema,
  HeartbeatRequestSchema,
  LeaseSchema,
  ProgressReportSchema,
} from "../../schemas/gateway";
import { ProgramSchema } from "../../schemas/program";
import { z } from "../../schemas/zod";

const tags = ["Gateway"];
const params = idParam("prg", "program");

export const claimProgramOperation = defineOperation({
  operationId: "claimProgram",
  method: "post",
  path: "/shears/{id}/claims",
  tags,
  scope: "gateway",
  summary: "Claim the next released program",
  description:
    "For the gateway beside a shear: takes the released program with the highest priority, then the earliest due date, then the oldest, under a lease. With `waitSeconds` the call waits (long poll) up to 30 s and answers 204 if nothing comes. Two gateways never get the same program. Keep the lease with heartbeats or progress reports; when it runs out the program goes back to `released`.",
  params: idParam("shr", "shear"),
  body: ClaimRequestSchema,
  responses: {
    200: { description: "A program, now `claimed` by this key.", schema: ClaimSchema },
    204: { description: "Nothing to claim." },
  },
});
export const heartbeatProgramOperation = defineOperation({
  operationId: "heartbeatProgram",
  method: "post",
  path: "/programs/{id}/heartbeat",
  tags,
  scope: "gateway",
  summary: "Keep the lease",
  params,
  body: HeartbeatRequestSchema,
  errors: [409],
  responses: {
    200: {
      description: "The lease, extended.",
      schema: z.object({ program: ProgramSchema, lease: LeaseSchema }).openapi("Heartbeat"),
    },
  },
});
export const startProgramOperation = defineOperation({
  operationId: "startProgram",
  method: "post",
  path: "/programs/{id}/start",
  tags,
  scope: "gateway",
  summary: "Report that the run started",
  description: "From `claimed` to `running`.",
  params,
  errors: [409],
  responses: { 200: { description: "The running program.", schema: ProgramSchema } },
});
export const reportProgressOperation = defineOperation({
  operationId: "reportProgress",
  method: "post",
  path: "/programs/{id}/progress",
  tags,
  scope: "gateway",
  summary: "Report progress",
  description: "Groups and strokes done so far; also keeps the lease.",
  params,
  body: ProgressReportSchema,
  errors: [409],
  responses: { 200: { description: "The program with its progress.", schema: ProgramSchema } },
});
export const completeProgramOperation = defineOperation({
  operationId: "completeProgram",
  method: "post",
  path: "/programs/{id}/complete",
  tags,
  scope: "gateway",
  summary: "Report completion",
  description: "From `running` to `completed`, with good and scrapped pieces.",
  params,
  body: CompletionReportSchema,
  errors: [409],
  responses: { 200: { description: "The completed program.", schema: ProgramSchema } },
});
export const failProgramOperation = defineOperation({
  operationId: "failProgram",
  method: "post",
  path: "/programs/{id}/fail",
  tags,
  scope: "gateway",
  summary: "Report a failed run",
  description:
    "From `claimed` or `running` to `failed`, with a reason code (for example `guard_tripped`, `overload`, `operator_abort`).",
  params,
  body: FailureReportSchema,
  errors: [409],
  responses: { 200: { description: "The failed program.", schema: ProgramSchema } },
});

export const gatewayOperations = [
  claimProgramOperation,
  heartbeatProgramOperation,
  startProgramOperation,
  reportProgressOperation,
  completeProgramOperation,
  failProgramOperation,
];
