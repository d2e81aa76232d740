/**
 * Every migration, in order. Listed in code (not discovered from the folder) so they run the
 * same from the built server, the test suite and the command line.
 * `npm run migration:create -- <name>` writes a new file here; add it to this list.
 */
import type { MigrationObject } from "@mikro-orm/core";
import { Migration20261201234604_initial } from "./Migration20261201234604_initial";
import { Migration20261201235446_api } from "./Migration20261201235446_api";
import { Migration20261202001919_hub } from "./Migration20261202001919_hub";
import { Migration20261202005416_team } from "./Migration20261202005416_team";
import { Migration20261202021005_plans } from "./Migration20261202021005_plans";
import { Migration20261202155743_text_columns } from "./Migration20261202155743_text_columns";
import { Migration20261202160834_console_sessions } from "./Migration20261202160834_console_sessions";
import { Migration20261202160000_shear_crown_baseline } from "./Migration20261202160000_shear_crown_baseline";
import { Migration20261202163000_backgauge_repeatability } from "./Migration20261202163000_backgauge_repeatability";
import { Migration20261202170059_plan_jobs } from "./Migration20261202170059_plan_jobs";
import { Migration20261202180135_attempt_headers } from "./Migration20261202180135_attempt_headers";
import { Migration20261203060000_routing } from "./Migration20261203060000_routing";
import { Migration20261203063000_stock } from "./Migration20261203063000_stock";
import { Migration20261203070000_remnant_size } from "./Migration20261203070000_remnant_size";
import { Migration20261203080000_axis_names } from "./Migration20261203080000_axis_names";
import { Migration20261203081306_typed_columns } from "./Migration20261203081306_typed_columns";
import { Migration20261203090000_lz4_json } from "./Migration20261203090000_lz4_json";
import { Migration20261203110000_json_bodies } from "./Migration20261203110000_json_bodies";
import { Migration20261203170000_pending_events } from "./Migration20261203170000_pending_events";
import { Migration20261203220000_check_without_layout } from "./Migration20261203220000_check_without_layout";
import { Migration20261204070000_json_as_text } from "./Migration20261204070000_json_as_text";
import { Migration20261204200000_event_checks_once } from "./Migration20261204200000_event_checks_once";

export const migrationsList: MigrationObject[] = [
  { name: "Migration20261201234604_initial", class: Migration20261201234604_initial },
  { name: "Migration20261201235446_api", class: Migration20261201235446_api },
  { name: "Migration20261202001919_hub", class: Migration20261202001919_hub },
  { name: "Migration20261202005416_team", class: Migration20261202005416_team },
  { name: "Migration20261202021005_plans", class: Migration20261202021005_plans },
  { name: "Migration20261202155743_text_columns", class: Migration20261202155743_text_columns },
  { name: "Migration20261202160834_console_sessions", class: Migration20261202160834_console_sessions },
  { name: "Migration20261202160000_shear_crown_baseline", class: Migration20261202160000_shear_crown_baseline },
  { name: "Migration20261202163000_backgauge_repeatability", class: Migration20261202163000_backgauge_repeatability },
  { name: "Migration20261202170059_plan_jobs", class: Migration20261202170059_plan_jobs },
  { name: "Migration20261202180135_attempt_headers", class: Migration20261202180135_attempt_headers },
  { name: "Migration20261203060000_routing", class: Migration20261203060000_routing },
  { name: "Migration20261203063000_stock", class: Migration20261203063000_stock },
  { name: "Migration20261203070000_remnant_size", class: Migration20261203070000_remnant_size },
  { name: "Migration20261203080000_axis_names", class: Migration20261203080000_axis_names },
  { name: "Migration20261203081306_typed_columns", class: Migration20261203081306_typed_columns },
  { name: "Migration20261203090000_lz4_json", class: Migration20261203090000_lz4_json },
  { name: "Migration20261203110000_json_bodies", class: Migration20261203110000_json_bodies },
  { name: "Migration20261203170000_pending_events", class: Migration20261203170000_pending_events },
  { name: "Migration20261203220000_check_without_layout", class: Migration20261203220000_check_without_layout },
  { name: "Migration20261204070000_json_as_text", class: Migration20261204070000_json_as_text },
  { name: "Migration20261204200000_event_checks_once", class: Migration20261204200000_event_checks_once },
];
