import { defineConfig } from "vitest/config";
import { fileURLToPath } from "node:url";

export default defineConfig({
  resolve: { alias: { "@": fileURLToPath(new URL("./", import.meta.url)) } },
  test: {
    include: ["tests/**/*.test.ts"],
    benchmark: { include: ["tests/**/*.bench.ts"] },
    globalSetup: process.env.SHEARWIRE_UNIT_ONLY ? [] : ["tests/setup/global.ts"],
    testTimeout: 30_000,
    hookTimeout: 120_000,
    fileParallelism: false,
    pool: "forks",
  },
});
