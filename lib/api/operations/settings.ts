import { defineOperation } from "../operation";
import { SettingsSchema, SettingsPatchSchema } from "../../schemas/settings";

const tags = ["Settings"];

export const getSettingsOperation = defineOperation({
  operationId: "getSettings",
  method: "get",
  path: "/settings",
  tags,
  scope: "catalog:read",
  summary: "Read the shop's settings",
  responses: { 200: { description: "The settings.", schema: SettingsSchema } },
});

export const updateSettingsOperation = defineOperation({
  operationId: "updateSettings",
  method: "patch",
  path: "/settings",
  tags,
  scope: "settings:write",
  summary: "Change the shop's settings",
  description: "Only the settings sent change. Programs and plans already routed keep their shear.",
  body: SettingsPatchSchema,
  responses: { 200: { description: "The settings as they are now.", schema: SettingsSchema } },
});

export const settingsOperations = [getSettingsOperation, updateSettingsOperation];
