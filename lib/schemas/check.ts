/**
 * The shear core's check of a program as the API shows it: the findings (each with its JSON
 * pointer into the request), the recommended setup with the reason for each value, the force
 * against the shear's rating, the yield and the cycle estimate.
 */
import { VALIDATIONS } from "./enums";
import { z } from "./zod";
const Quantity = { value: z.number(), unit: z.string() };
const SetupValue = z
  .object({ ...Quantity, source: z.enum(["computed", "given"]), why: z.string() })
  .openapi("SetupValue");

export const FindingSchema = z
  .object({
    code: z
      .string()
      .openapi({ description: "Stable code; see the finding list in the docs", example: "backgauge_beyond_workpiece" }),
    severity: z
      .enum(["error", "warning"])
      .openapi({ description: "`error` blocks release; a `warning` must be acknowledged" }),
    message: z.string(),
    pointer: z
      .string()
      .openapi({ description: "JSON pointer into the submitted program", example: "/cuts/1/backgauge" }),
    limit: z.number().nullable(),
    actual: z.number().nullable(),
    unit: z.string().nullable(),
  })
  .openapi("Finding");

const Piece = z.object({ group: z.number().int(), width: z.number(), length: z.number(), count: z.number().int() });
const Totals = z.object({
  blanks: z.number(),
  blankArea: z.number(),
  offcutPieces: z.number(),
  offcutArea: z.number(),
  turnedPieces: z.number(),
  strokes: z.number(),
  stockArea: z.number(),
});

export const CheckSchema = z
  .object({
    validation: z.enum(VALIDATIONS),
    units: z.enum(["in", "mm"]).nullable(),
    findings: z.array(FindingSchema),
    thickness: z
      .object({
        value: z.number(),
        unit: z.enum(["in", "mm"]),
        source: z.enum(["value", "gauge"]),
        gauge: z.number().nullable(),
        gaugeFamily: z.string().nullable(),
      })
      .nullable(),
    setup: z
      .object({
        bladeGap: SetupValue.openapi({
          description: "The gap the material needs at this thickness (set at the blade ends)",
        }),
        gapEnds: SetupValue.optional().openapi({
          description: "Gap to set at the ends of the blade (absent from checks stored before it was reported)",
        }),
        gapCentre: SetupValue.optional().openapi({
          description:
            "Gap to set at the centre: the ends less the crown (absent from checks stored before it was reported)",
        }),
        rake: SetupValue,
        holdDown: SetupValue,
        crown: SetupValue.openapi({
          description: "Ends minus centre: a baseline with no load plus a part proportional to the force",
        }),
        backgaugeRetract: SetupValue,
      })
      .nullable()
      .openapi({ description: "Recommendations for a qualified operator, each with its reason; never a guarantee." }),
    force: z
      .object({
        unit: z.enum(["tonf", "kN"]),
        required: z.number(),
        rated: z.number(),
        capacityUsedPct: z.number(),
        dullBlade: z.object({ factor: z.number(), required: z.number(), capacityUsedPct: z.number() }),
        rakeDeg: z.number(),
        tensile: z.object({ ...Quantity, basis: z.enum(["minimum", "typical"]) }),
        maxThicknessForGrade: z.object({ ...Quantity, source: z.enum(["shear-profile", "model"]), why: z.string() }),
        byGroup: z.array(
          z.object({
            group: z.number().int(),
            cutLength: z.number(),
            force: z.number(),
            model: z.enum(["raked", "straight"]),
          }),
        ),
      })
      .nullable(),
    yield: z
      .object({
        lengthUnit: z.enum(["in", "mm"]),
        areaUnit: z.enum(["in2", "mm2"]),
        sheets: z.number().int(),
        perSheet: Totals,
        total: Totals,
        utilisationPct: z.number(),
        remnantToleranceMm: z.number().optional().openapi({
          description:
            "A remnant within this many mm of a piece's size was counted as that piece: the shear's backgauge repeatability, or 0.1 mm when it states none. The program's layout is placed with the same tolerance. Absent from checks stored before it was reported.",
        }),
        groups: z.array(
          z.object({
            group: z.number().int(),
            workpieces: z.number(),
            strokes: z.number(),
            pieces: z.array(Piece),
            piecesBecome: z.enum(["blanks", "offcut", "turned"]),
          }),
        ),
        blanks: z.array(Piece),
        offcuts: z.array(Piece),
      })
      .nullable(),
    estimate: z
      .object({
        strokes: z.number(),
        backgaugeMoves: z.number(),
        turns: z.number(),
        sheets: z.number(),
        seconds: z.object({
          strokes: z.number(),
          backgauge: z.number(),
          turns: z.number(),
          sheets: z.number(),
          total: z.number(),
        }),
      })
      .nullable(),
  })
  .openapi("Check", {
    description:
      "What the shear core made of a program: findings, setup, force, yield and cycle estimate, in the program's units.",
  });

export type CheckT = z.infer<typeof CheckSchema>;

export const SheetLayoutSchema = z
  .object({
    unit: z.enum(["in", "mm"]),
    rectangles: z.array(
      z.object({
        kind: z.enum(["blank", "scrap", "offcut"]),
        group: z.number().int().openapi({ description: "Group that made it (−1: the stock sheet, never cut)" }),
        stroke: z.number().int().nullable().openapi({
          description:
            "1-based stroke on the sheet, in cutting order, that cut it off; null for a remnant taken as a piece and for offcut left over",
        }),
        x: z.number(),
        y: z.number(),
        length: z.number().openapi({ description: "Extent along x (the sheet's length, along the blade)" }),
        width: z.number().openapi({ description: "Extent along y (the sheet's width, toward the backgauge)" }),
      }),
    ),
    cuts: z.array(
      z.object({
        group: z.number().int(),
        stroke: z.number().int(),
        x1: z.number(),
        y1: z.number(),
        x2: z.number(),
        y2: z.number(),
        partial: z.boolean().openapi({ description: "A partial stroke: cuts part of the edge, severs nothing" }),
      }),
    ),
  })
  .openapi("SheetLayout", {
    description:
      "One sheet as it is cut, from the same piece flow as the yield: x along the sheet's length (the edge first presented to the blade), y along its width toward the backgauge, origin at the corner where the first strip is cut, in the program's units; a rectangle's `length` runs along x and its `width` along y, as the sheet's do.",
  });
