import { defineOperation } from "../operation";
import { Settings, SettingsPatch } from "../../schemas/settings";

const tags = ["Settings"];

export const getSettings = defineOperation({
  operationId: "getSettings",
  method: "get",
  path: "/settings",
  tags,
  scope: "catalog:read",
  summary: "Read the shop's settings",
  responses: { 200: { description: "The settings.", schema: Settings } },
});

export const updateSettings = defineOperation({
  operationId: "updateSettings",
  method: "patch",
  path: "/settings",
  tags,
  scope: "settings:write",
  summary: "Change the shop's settings",
  description: "Only the settings sent change. Programs and plans already routed keep their shear.",
  body: SettingsPatch,
  responses: { 200: { description: "The settings as they are now.", schema: Settings } },
});

export const settingsOperations = [getSettings, updateSettings];
