/**
 * Cut lists from files: a CSV with one row per cut group (rows sharing a reference make one
 * program), or a JSON file with one program or a list of them. Every program is validated
 * with the same schema as the API; any error names its row, and then nothing is imported.
 */
import type { EntityManager } from "@mikro-orm/postgresql";
import { parse } from "csv-parse/sync";
import { ApiError, type ProblemBody } from "../errors";
import { Shear } from "../../entities";
import { ProgramInputSchema, type ProgramInputT } from "../schemas/program";
import { createBatch } from "./program-batch";

export const CSV_COLUMNS = [
  "reference",
  "title",
  "shear",
  "grade",
  "thickness",
  "gauge",
  "units",
  "sheet_length",
  "sheet_width",
  "sheet_count",
  "backgauge",
  "count",
  "length",
  "turn",
  "scrap",
  "note",
  "priority",
  "due_at",
] as const;

export interface RowError {
  /** 1-based line in the file (the header is line 1), or the program's index in a JSON list */
  row: number;
  field: string;
  message: string;
}

interface Parsed {
  programs: { input: unknown; rows: number[] }[];
  errors: RowError[];
}

export const num = (v: string | undefined) => (v === undefined || v.trim() === "" ? undefined : Number(v));
export const bool = (raw: string | undefined) =>
  raw === undefined || raw.trim() === "" ? undefined : ["1", "true", "yes", "y"].includes(raw.trim().toLowerCase());
export const text = (v: string | undefined) => (v === undefined || v.trim() === "" ? undefined : v.trim());

export function parseCsv(content: string): Parsed {
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
      programs: [],
      errors: [{ row: 0, field: "file", message: `not readable as CSV: ${(err as Error).message}` }],
    };
  }
  const errors: RowError[] = [];
  if (records.length && !("reference" in records[0])) {
    return {
      programs: [],
      errors: [{ row: 1, field: "header", message: `the first line must name the columns: ${CSV_COLUMNS.join(", ")}` }],
    };
  }
  const byRef = new Map<string, { input: Record<string, unknown>; rows: number[] }>();
  const NUMERIC = [
    "thickness",
    "gauge",
    "sheet_length",
    "sheet_width",
    "sheet_count",
    "backgauge",
    "count",
    "length",
    "priority",
  ];
  records.forEach((row, index) => {
    const line = index + 2;
    for (const col of NUMERIC) {
      if (text(row[col]) !== undefined && !Number.isFinite(Number(row[col])))
        errors.push({ row: line, field: col, message: `"${row[col]}" is not a number` });
    }
    const ref = text(row.reference);
    if (!ref) {
      errors.push({ row: line, field: "reference", message: "every row needs the program's reference" });
      return;
    }
    let entry = byRef.get(ref);
    if (!entry) {
      const thickness = num(row.gauge) !== undefined ? { gauge: num(row.gauge) } : { value: num(row.thickness) };
      entry = {
        rows: [],
        input: {
          reference: ref,
          title: text(row.title),
          shear: text(row.shear),
          grade: text(row.grade),
          thickness,
          units: text(row.units),
          sheet: { length: num(row.sheet_length), width: num(row.sheet_width), count: num(row.sheet_count) ?? 1 },
          cuts: [],
          priority: num(row.priority),
          dueAt: text(row.due_at),
        },
      };
      byRef.set(ref, entry);
    }
    entry.rows.push(line);
    (entry.input.cuts as unknown[]).push(
      JSON.parse(
        JSON.stringify({
          backgauge: num(row.backgauge),
          count: num(row.count),
          length: num(row.length),
          turn: bool(row.turn),
          scrap: bool(row.scrap),
          note: text(row.note),
        }),
      ),
    );
  });
  return {
    programs: [...byRef.values()].map((p) => ({ input: JSON.parse(JSON.stringify(p.input)), rows: p.rows })),
    errors,
  };
}

export function parseJson(content: string): Parsed {
  let value: unknown;
  try {
    value = JSON.parse(content);
  } catch (err) {
    return { programs: [], errors: [{ row: 0, field: "file", message: `not valid JSON: ${(err as Error).message}` }] };
  }
  const list = Array.isArray(value) ? value : [value];
  return { programs: list.map((input, i) => ({ input, rows: [i + 1] })), errors: [] };
}

/**
 * A cut list may name its shear by name ("Bay 1 sheet shear", any case) as well as by id: names
 * of this shop's shears in use become their ids; a name no shear has is an error on that row.
 */
export async function resolveShearNames(em: EntityManager, shopId: string, parsed: Parsed): Promise<Parsed> {
  const shears = await em.find(Shear, { shop: shopId, archivedAt: null }, { fields: ["name"] });
  const byName = new Map(shears.map((s) => [s.name.trim().toLowerCase(), s.id]));
  const errors: RowError[] = [];
  const programs = parsed.programs.map((program) => {
    const input = program.input as Record<string, unknown> | null;
    const shear = typeof input?.shear === "string" ? input.shear.trim() : null;
    if (!input || !shear || /^shr_[0-9A-Z]{26}$/.test(shear)) return program;
    const id = byName.get(shear.toLowerCase());
    if (!id)
      errors.push({
        row: program.rows[0],
        field: "shear",
        message: `no shear in use is named "${shear}" (names: ${shears.map((s) => s.name).join(", ") || "none yet"})`,
      });
    return { ...program, input: { ...input, shear: id ?? shear } };
  });
  return { programs, errors: [...parsed.errors, ...errors] };
}

/** The CSV a person fills in: the header and two rows of an example (the first shear's name in it). */
export function csvTemplate(shearName: string): string {
  const quote = (v: string) => (/[",\n]/.test(v) ? `"${v.replace(/"/g, '""')}"` : v);
  return (
    [
      CSV_COLUMNS.join(","),
      [
        "SO-2291/4",
        "Side panels",
        quote(shearName),
        "A36",
        "",
        "10",
        "in",
        "120",
        "48",
        "2",
        "12",
        "3",
        "",
        "",
        "",
        "rip strips",
        "5",
        "2026-12-08T14:00:00Z",
      ].join(","),
      ["SO-2291/4", "", "", "", "", "", "", "", "", "", "16", "7", "12", "yes", "", "crosscut each strip", "", ""].join(
        ",",
      ),
    ].join("\n") + "\n"
  );
}

/** Validate every program; an error inside cuts/N points at the N-th row of that program. */
export function validate(parsed: Parsed): { inputs: ProgramInputT[]; errors: RowError[] } {
  const errors = [...parsed.errors];
  const inputs: ProgramInputT[] = [];
  const seen = new Set<string>();
  for (const program of parsed.programs) {
    const result = ProgramInputSchema.safeParse(program.input);
    if (!result.success) {
      for (const issue of result.error.issues) {
        const cut = issue.path[0] === "cuts" && typeof issue.path[1] === "number" ? issue.path[1] : null;
        errors.push({
          row: cut !== null ? (program.rows[cut] ?? program.rows[0]) : program.rows[0],
          field: issue.path.join(".") || "program",
          message: issue.message,
        });
      }
      continue;
    }
    if (seen.has(result.data.reference))
      errors.push({
        row: program.rows[0],
        field: "reference",
        message: `reference ${result.data.reference} appears twice`,
      });
    seen.add(result.data.reference);
    inputs.push(result.data);
  }
  return { inputs, errors: errors.sort((a, b) => a.row - b.row) };
}

/** Create every program through the batch path, in one transaction: all of them, or none. */
export async function importPrograms(
  em: EntityManager,
  shopId: string,
  inputs: ProgramInputT[],
  rowsOf: (rowIndex: number) => number,
) {
  try {
    const created = await createBatch(em, shopId, inputs);
    return {
      created: created.map((p) => ({ id: p.id, reference: p.reference, validation: p.validation })),
      errors: [],
    };
  } catch (err) {
    const failures = err instanceof ApiError ? (err.extensions.failures as ProblemBody[] | undefined) : undefined;
    if (!failures) throw err;
    const errors: RowError[] = failures.map((failure) => ({
      row: rowsOf(failure.index as number),
      field:
        (failure.errors as { pointer: string }[] | undefined)?.[0]?.pointer.replace(/^\/programs\/\d+\//, "") ??
        "program",
      message: failure.detail.replace(/^Program \d+: /, ""),
    }));
    return { created: [], errors };
  }
}
