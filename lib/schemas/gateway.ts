/** What machine-side gateways send and receive. */
import { ProgramSchema } from "./program";
import { z } from "./zod";

export const FAILURE_REASONS = [
  "guard_tripped",
  "light_curtain",
  "overload",
  "operator_abort",
  "blade_damage",
  "material_problem",
  "backgauge_fault",
  "hydraulic_fault",
  "power_loss",
  "other",
] as const;

/** A count a run reports; checked against the program as well (a run cannot make more than its program). */
const count = () => z.number().int().min(0).max(10_000_000);

const leaseSeconds = z
  .number()
  .int()
  .min(10)
  .max(600)
  .optional()
  .openapi({ description: "Lease length in seconds (default 60)" });

export const ClaimRequestSchema = z
  .object({
    waitSeconds: z
      .number()
      .min(0)
      .max(30)
      .optional()
      .openapi({ description: "Wait up to this long for a program (long poll); 0 answers at once. Default 0." }),
    leaseSeconds,
  })
  .strict()
  .openapi("ClaimRequest");

export const LeaseSchema = z.object({ expiresAt: z.string(), seconds: z.number().int() }).openapi("Lease");
export const ClaimSchema = z.object({ program: ProgramSchema, lease: LeaseSchema }).openapi("Claim");

export const HeartbeatRequestSchema = z.object({ leaseSeconds }).strict().openapi("HeartbeatRequest");

export const ProgressReportSchema = z
  .object({
    groupsDone: count().openapi({
      description: "Cut groups finished, over all sheets so far (at most the program's groups × sheets)",
    }),
    strokesDone: count().openapi({ description: "Strokes made so far (at most the program's strokes)" }),
    piecesDone: count().optional().openapi({ description: "Blanks made so far (at most the program's blanks)" }),
    leaseSeconds,
  })
  .strict()
  .openapi("ProgressReport");

export const CompletionReportSchema = z
  .object({
    goodPieces: count().openapi({
      description: "Good blanks made; with `scrappedPieces`, at most the program's blanks",
    }),
    scrappedPieces: count().default(0),
    sheetsUsed: count().optional().openapi({
      description:
        "Sheets cut (at most the program's `sheet.count`; default all of them): booked out of the stock reserved for the program",
    }),
    notes: z.string().max(2000).optional(),
  })
  .strict()
  .openapi("CompletionReport");

export const FailureReportSchema = z
  .object({
    reason: z.enum(FAILURE_REASONS).openapi({ description: "Why the run stopped" }),
    message: z.string().max(2000).optional(),
    goodPieces: count().optional(),
    scrappedPieces: count().optional(),
    sheetsUsed: count().optional().openapi({
      description:
        "Sheets cut or spoiled before the run stopped (at most the program's `sheet.count`; default 0): booked out of the stock reserved for the program, the rest given back",
    }),
  })
  .strict()
  .openapi("FailureReport");
