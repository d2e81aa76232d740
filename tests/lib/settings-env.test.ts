/** Whole-number settings from the environment: the default when unset or blank, the value when whole and ≥ 1, else refused by name. */
import { describe, expect, it } from "vitest";
import { wholeNumberSetting } from "../../lib/settings-env";

describe("wholeNumberSetting", () => {
  const read = (value: string | undefined) => wholeNumberSetting({ X_TURNS: value }, "X_TURNS", "turns", () => 7);
  it("takes the default when the setting is unset or blank", () => {
    expect(read(undefined)).toBe(7);
    expect(read("  ")).toBe(7);
  });
  it("takes a whole number of 1 or more", () => {
    expect(read("1")).toBe(1);
    expect(read("32")).toBe(32);
  });
  it.each(["0", "-2", "1.5", "two", "NaN"])("refuses %s, naming the setting", (value) => {
    expect(() => read(value)).toThrow(`X_TURNS must be a whole number of turns, 1 or more (it is "${value}")`);
  });
});
