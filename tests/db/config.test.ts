import { describe, expect, it } from "vitest";
import { poolSize } from "../../lib/db/config";

// The default follows the common sizing rule for database pools, cores × 2 + effective spindles with one
// spindle (common practice); what it does to throughput is measured by `npm run bench`, not here.
describe("poolSize", () => {
  it("is twice the cores plus one, at most 20, when SHEARWIRE_DB_POOL is not set", () => {
    expect(poolSize({}, 2)).toBe(5);
    expect(poolSize({}, 8)).toBe(17);
    expect(poolSize({}, 64)).toBe(20);
    expect(poolSize({ SHEARWIRE_DB_POOL: " " }, 1)).toBe(3);
  });

  it("takes SHEARWIRE_DB_POOL when it is a whole number of connections", () => {
    expect(poolSize({ SHEARWIRE_DB_POOL: "20" }, 2)).toBe(20);
    expect(poolSize({ SHEARWIRE_DB_POOL: "1" }, 64)).toBe(1);
  });

  it.each(["0", "-3", "2.5", "twenty", "NaN"])("refuses SHEARWIRE_DB_POOL=%s with a message naming it", (value) => {
    expect(() => poolSize({ SHEARWIRE_DB_POOL: value }, 2)).toThrow(/SHEARWIRE_DB_POOL must be a whole number/);
  });
});
