import { defineOperation } from "../operation";
import { idParam, listOf, PaginationSchema } from "../../schemas/common";
import {
  ReserveInputSchema,
  StockAdjustInputSchema,
  StockItemSchema,
  StockItemInputSchema,
  StockListQuerySchema,
  StockReservationSchema,
} from "../../schemas/stock";

const tags = ["Stock"];
const params = idParam("stk", "stock item");

export const listStockOperation = defineOperation({
  operationId: "listStock",
  method: "get",
  path: "/stock",
  tags,
  scope: "stock:read",
  summary: "List stock on hand",
  description: "Newest first; filter by grade, thickness and kind. Archived items only with `includeArchived=true`.",
  query: PaginationSchema.extend(StockListQuerySchema.shape),
  responses: { 200: { description: "A page of stock items.", schema: listOf(StockItemSchema, "StockItemList") } },
});

export const createStockItemOperation = defineOperation({
  operationId: "createStockItem",
  method: "post",
  path: "/stock",
  tags,
  scope: "stock:write",
  summary: "Add stock",
  description: "Full sheets as bought, or a remnant (which may name the program and run it came from).",
  body: StockItemInputSchema,
  responses: { 201: { description: "Added.", schema: StockItemSchema } },
});

export const getStockItemOperation = defineOperation({
  operationId: "getStockItem",
  method: "get",
  path: "/stock/{id}",
  tags,
  scope: "stock:read",
  summary: "Read a stock item",
  params,
  responses: { 200: { description: "The stock item.", schema: StockItemSchema } },
});

export const adjustStockOperation = defineOperation({
  operationId: "adjustStock",
  method: "post",
  path: "/stock/{id}/adjust",
  tags,
  scope: "stock:write",
  summary: "Adjust a stock item's quantity",
  description:
    "Adds or takes away sheets, with the reason (sent on the `stock.adjusted` event). Never below the sheets reserved: 409.",
  params,
  body: StockAdjustInputSchema,
  errors: [409],
  responses: { 200: { description: "The item as it is now.", schema: StockItemSchema } },
});

export const archiveStockItemOperation = defineOperation({
  operationId: "archiveStockItem",
  method: "post",
  path: "/stock/{id}/archive",
  tags,
  scope: "stock:write",
  summary: "Archive a stock item",
  description: "No longer offered to plans or reservations. Refused (409) while any of its sheets are reserved.",
  params,
  errors: [409],
  responses: { 200: { description: "The archived item.", schema: StockItemSchema } },
});

export const reserveStockOperation = defineOperation({
  operationId: "reserveStock",
  method: "post",
  path: "/stock/{id}/reservations",
  tags,
  scope: "stock:write",
  summary: "Reserve sheets",
  description:
    "Holds sheets for a program (cancelling it gives them back) or by hand. Only what is available can be reserved; concurrent requests never take the same sheet: the one that finds too few gets 409 `stock-not-available`.",
  params,
  body: ReserveInputSchema,
  errors: [409],
  responses: { 201: { description: "Reserved.", schema: StockReservationSchema } },
});

export const releaseReservationOperation = defineOperation({
  operationId: "releaseReservation",
  method: "post",
  path: "/stock-reservations/{id}/release",
  tags,
  scope: "stock:write",
  summary: "Give reserved sheets back",
  params: idParam("srv", "reservation"),
  errors: [409],
  responses: { 200: { description: "The released reservation.", schema: StockReservationSchema } },
});

export const stockOperations = [
  listStockOperation,
  createStockItemOperation,
  getStockItemOperation,
  adjustStockOperation,
  archiveStockItemOperation,
  reserveStockOperation,
  releaseReservationOperation,
];
