/** Gauges and the stand-alone setup recommendation. */
import { z } from "./zod";
import { ThicknessSchema } from "./program";

export const GaugeTableSchema = z
  .object({
    family: z.enum(["msg", "galvanized", "ussg", "awg"]),
    name: z.string(),
    definition: z.string(),
    rows: z.array(z.object({ gauge: z.number().int(), in: z.number(), mm: z.number() })),
  })
  .openapi("GaugeTable");

export const GaugeQuerySchema = z.object({
  family: z.enum(["msg", "galvanized", "ussg", "awg"]).optional().openapi({ description: "Only this gauge system" }),
});

export const SetupRequestSchema = z
  .object({
    shear: z.string().min(1).max(64),
    grade: z.string().trim().min(1).max(50),
    thickness: ThicknessSchema,
    units: z.enum(["in", "mm"]),
    length: z
      .number()
      .positive()
      .max(100_000)
      .optional()
      .openapi({ description: "Length of cut in `units`; defaults to the blade length" }),
  })
  .strict()
  .openapi("SetupRequest");
