/**
 * The floors of the code (DEVELOPERS.md, "Layout"): each folder may import only the floors
 * below it and its own. `npm test` runs these rules (tests/house/floors.test.ts); an upward
 * import or a cycle fails the suite.
 */
const NEUTRAL = "^lib/[^/]+\\.ts$"; // ids, text, errors, network, version, redis, security headers, fonts
const floor = (...folders) => [NEUTRAL, ...folders.map((f) => `^${f}/`)];

/** folder → the folders it may import (besides packages and Node's own modules). */
const FLOORS = {
  "lib/shear": floor("lib/shear"),
  "lib/planner": floor("lib/planner", "lib/shear"),
  "lib/schemas": floor("lib/schemas", "lib/planner", "lib/shear"),
  entities: floor("entities", "lib/schemas"),
  migrations: floor("migrations"),
  "lib/db": floor("lib/db", "entities", "migrations", "lib/schemas"),
  "lib/queue": floor("lib/queue", "lib/planner", "lib/schemas"),
  "lib/services": floor("lib/services", "lib/queue", "lib/db", "entities", "lib/schemas", "lib/planner", "lib/shear"),
  "lib/auth": floor("lib/auth", "lib/services", "lib/db", "entities", "lib/schemas"),
  "lib/api": floor(
    "lib/api",
    "lib/auth",
    "lib/services",
    "lib/queue",
    "lib/db",
    "entities",
    "lib/schemas",
    "lib/planner",
    "lib/shear",
  ),
  "lib/worker": floor(
    "lib/worker",
    "lib/services",
    "lib/queue",
    "lib/db",
    "entities",
    "lib/schemas",
    "lib/planner",
    "lib/shear",
  ),
  // Client components call the console's server actions (the framework's way of posting forms).
  components: [...floor("components", "lib/schemas", "lib/shear", "lib/auth"), "^app/[^.]*actions\\.ts$"],
};

const OURS = "^(lib|entities|migrations|app|components|scripts|tests)/|^proxy\\.ts$";

module.exports = {
  forbidden: [
    {
      name: "no-cycles",
      severity: "error",
      comment: "A cycle ties modules together so neither can be read, tested or moved alone.",
      from: {},
      to: { circular: true },
    },
    {
      name: "neutral-stays-neutral",
      severity: "error",
      comment: "Files directly under lib/ are used by every floor and import none of them.",
      from: { path: NEUTRAL },
      to: { path: OURS, pathNot: NEUTRAL },
    },
    ...Object.entries(FLOORS).map(([folder, allowed]) => ({
      name: `floor-${folder.replace(/\//g, "-")}`,
      severity: "error",
      comment: `${folder} imports only the floors below it (DEVELOPERS.md, "Layout").`,
      from: { path: `^${folder}/` },
      to: { path: OURS, pathNot: allowed },
    })),
    {
      name: "no-tests-in-product",
      severity: "error",
      comment: "Product code never imports test code.",
      from: { path: "^(lib|entities|migrations|app|components|scripts)/|^proxy\\.ts$" },
      to: { path: "^tests/" },
    },
  ],
  options: {
    doNotFollow: { path: "node_modules" },
    exclude: { path: "^(node_modules|\\.next|\\.next-test|tests/fixtures/floors)" },
    tsConfig: { fileName: "tsconfig.json" },
    tsPreCompilationDeps: true,
    enhancedResolveOptions: {
      exportsFields: ["exports"],
      conditionNames: ["import", "require", "node", "default"],
      extensions: [".ts", ".tsx", ".mjs", ".js"],
    },
  },
};
