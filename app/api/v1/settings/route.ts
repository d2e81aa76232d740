import { getSettingsOperation, updateSettingsOperation } from "@/lib/api/operations/settings";
import { route } from "@/lib/api/route";
import * as settings from "@/lib/services/settings";

export const GET = route(getSettingsOperation, async ({ em, principal }) => ({
  body: await settings.getSettings(em, principal.shopId),
}));

export const PATCH = route(updateSettingsOperation, async ({ em, principal, body }) => ({
  body: await settings.updateSettings(em, principal.shopId, body),
}));
