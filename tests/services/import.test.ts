import { describe, expect, it } from "vitest";
import { parseCsv, parseJson, validate } from "../../lib/services/import";

const header =
  "reference,title,shear,grade,thickness,gauge,units,sheet_length,sheet_width,sheet_count,backgauge,count,length,turn,scrap,note,priority,due_at";

describe("cut list files", () => {
  it("turns rows that share a reference into one program, cuts in row order", () => {
    const csv = [
      header,
      "A-1,Brackets,shr_1,A36,,10,in,120,48,2,12,3,,,,rips,5,2026-12-08T14:00:00Z",
      "A-1,,,,,,,,,,16,7,12,yes,,,,",
    ].join("\n");
    const { inputs, errors } = validate(parseCsv(csv));
    expect(errors).toEqual([]);
    expect(inputs).toEqual([
      {
        reference: "A-1",
        title: "Brackets",
        shear: "shr_1",
        grade: "A36",
        thickness: { gauge: 10 },
        units: "in",
        sheet: { length: 120, width: 48, count: 2 },
        cuts: [
          { backgauge: 12, count: 3, note: "rips" },
          { backgauge: 16, count: 7, length: 12, turn: true },
        ],
        priority: 5,
        dueAt: "2026-12-08T14:00:00Z",
      },
    ]);
  });

  it("names the row of every problem", () => {
    const csv = [
      header,
      "A-1,,shr_1,A36,0.25,,in,96,48,1,12,2,,,,,,",
      "A-1,,,,,,,,,,-4,2,,,,,,",
      ",,,,,,,,,,1,1,,,,,,",
      "B-1,,shr_1,A36,0.25,,furlongs,96,48,1,12,2,,,,,,",
    ].join("\n");
    const { errors } = validate(parseCsv(csv));
    expect(errors.map((e) => [e.row, e.field])).toEqual([
      [3, "cuts.1.backgauge"],
      [4, "reference"],
      [5, "units"],
    ]);
  });

  it("refuses a file without the header and unreadable JSON", () => {
    expect(parseCsv("A-1,x\nB-1,y").errors[0]).toMatchObject({ row: 1, field: "header" });
    expect(parseJson("{nope").errors[0]).toMatchObject({ field: "file" });
  });

  it("reads JSON with one program or a list", () => {
    const one = {
      reference: "J-1",
      shear: "shr_1",
      grade: "A36",
      thickness: { value: 3 },
      units: "mm",
      sheet: { length: 3000, width: 1500, count: 1 },
      cuts: [{ backgauge: 500, count: 2 }],
    };
    expect(validate(parseJson(JSON.stringify(one))).inputs).toHaveLength(1);
    const two = validate(parseJson(JSON.stringify([one, { ...one, reference: "J-1" }])));
    expect(two.errors).toEqual([{ row: 2, field: "reference", message: "reference J-1 appears twice" }]);
  });
});
