/** Every operation of API v1; the OpenAPI document and the route-file test read this list. */
import type { Operation } from "../operation";
import { catalogOperations } from "./catalog";
import { metaOperations } from "./meta";
import { programOperations } from "./programs";

export const operations: Operation[] = [...programOperations, ...catalogOperations, ...metaOperations] as Operation[];
