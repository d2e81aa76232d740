/** Every operation of API v1; the OpenAPI document and the route-file test read this list. */
import type { Operation } from "../operation";
import { catalogOperations } from "./catalog";
import { gatewayOperations } from "./gateway";
import { metaOperations } from "./meta";
import { planOperations } from "./plans";
import { programOperations } from "./programs";
import { settingsOperations } from "./settings";
import { stockOperations } from "./stock";
import { webhookOperations } from "./webhooks";

export const operations: Operation[] = [
  ...programOperations,
  ...planOperations,
  ...stockOperations,
  ...gatewayOperations,
  ...webhookOperations,
  ...catalogOperations,
  ...settingsOperations,
  ...metaOperations,
] as Operation[];
