/** Gauges and the stand-alone setup recommendation. */
import { z } from "./zod";
import { Thickness } from "./program";

export const GaugeTable = z
  .object({
    family: z.enum(["msg", "galvanized", "ussg", "awg"]),
    name: z.string(),
    definition: z.string(),
    rows: z.array(z.object({ gauge: z.number().int(), in: z.number(), mm: z.number() })),
  })
  .openapi("GaugeTable");

export const GaugeQuery = z.object({
  family: z.enum(["msg", "galvanized", "ussg", "awg"]).optional().openapi({ description: "Only this gauge system" }),
});

export const SetupRequest = z
  .object({
    shear: z.string().min(1).max(64),
    grade: z.string().trim().min(1).max(50),
    thickness: Thickness,
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
