/** Blanks for a plan from a CSV file: one row per blank type. */
import { parse } from "csv-parse/sync";
import { RowError, num, bool, text } from "./import";

/** Blanks for the planner from a CSV: one row per blank (order line). */
export const BLANK_COLUMNS = ["label", "length", "width", "quantity", "can_turn"] as const;

export function parseBlanksCsv(content: string): { blanks: Record<string, unknown>[]; errors: RowError[] } {
  let records: Record<string, string>[];
  try {
    records = parse(content, {
      columns: (h: string[]) => h.map((c) => c.trim().toLowerCase()),
      skip_empty_lines: true,
      trim: true,
      bom: true,
    });
  } catch (err) {
    return {
      blanks: [],
      errors: [{ row: 0, field: "file", message: `not readable as CSV: ${(err as Error).message}` }],
    };
  }
  if (!records.length)
    return {
      blanks: [],
      errors: [{ row: 1, field: "file", message: "no blanks: one row per blank after the header line" }],
    };
  if (!("label" in records[0] && "length" in records[0] && "width" in records[0] && "quantity" in records[0])) {
    return {
      blanks: [],
      errors: [
        {
          row: 1,
          field: "header",
          message: `the first line must name the columns: ${BLANK_COLUMNS.join(", ")} (can_turn may be left out)`,
        },
      ],
    };
  }
  const errors: RowError[] = [];
  const blanks = records.map((row, index) => {
    for (const col of ["length", "width", "quantity"]) {
      if (!Number.isFinite(Number(row[col])) || text(row[col]) === undefined)
        errors.push({ row: index + 2, field: col, message: `"${row[col] ?? ""}" is not a number` });
    }
    return JSON.parse(
      JSON.stringify({
        label: text(row.label),
        length: num(row.length),
        width: num(row.width),
        quantity: num(row.quantity),
        canTurn: bool(row.can_turn),
      }),
    ) as Record<string, unknown>;
  });
  return { blanks, errors };
}
