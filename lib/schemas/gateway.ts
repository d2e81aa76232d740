/** What machine-side gateways send and receive. */
import { Program } from "./program";
import { z } from "./zod";

export const FAILURE_REASONS = [
  "guard_tripped", "light_curtain", "overload", "operator_abort", "blade_damage", "material_problem",
  "backgauge_fault", "hydraulic_fault", "power_loss", "other",
] as const;

const leaseSeconds = z.number().int().min(10).max(600).optional().openapi({ description: "Lease length in seconds (default 60)" });

export const ClaimRequest = z
  .object({
    waitSeconds: z.number().min(0).max(30).optional().openapi({ description: "Wait up to this long for a program (long poll); 0 answers at once. Default 0." }),
    leaseSeconds,
  })
  .strict()
  .openapi("ClaimRequest");

export const Lease = z.object({ expiresAt: z.string(), seconds: z.number().int() }).openapi("Lease");
export const Claim = z.object({ program: Program, lease: Lease }).openapi("Claim");

export const HeartbeatRequest = z.object({ leaseSeconds }).strict().openapi("HeartbeatRequest");

export const ProgressReport = z
  .object({
    groupsDone: z.number().int().min(0).openapi({ description: "Cut groups finished, over all sheets so far" }),
    strokesDone: z.number().int().min(0),
    piecesDone: z.number().int().min(0).optional(),
    leaseSeconds,
  })
  .strict()
  .openapi("ProgressReport");

export const CompletionReport = z
  .object({
    goodPieces: z.number().int().min(0),
    scrappedPieces: z.number().int().min(0).default(0),
    sheetsUsed: z.number().int().min(0).optional(),
    notes: z.string().max(2000).optional(),
  })
  .strict()
  .openapi("CompletionReport");

export const FailureReport = z
  .object({
    reason: z.enum(FAILURE_REASONS).openapi({ description: "Why the run stopped" }),
    message: z.string().max(2000).optional(),
    goodPieces: z.number().int().min(0).optional(),
    scrappedPieces: z.number().int().min(0).optional(),
  })
  .strict()
  .openapi("FailureReport");
