/**
 * Every migration, in order. Listed in code (not discovered from the folder) so they run the
 * same from the built server, the test suite and the command line.
 * `npm run migration:create -- <name>` writes a new file here; add it to this list.
 */
import type { MigrationObject } from "@mikro-orm/core";
import { Migration20261201234041_initial } from "./Migration20261201234041_initial";

export const migrationsList: MigrationObject[] = [
  { name: "Migration20261201234041_initial", class: Migration20261201234041_initial },
];
