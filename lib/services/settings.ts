/** The shop's settings: how work that names no shear is routed. */
import type { EntityManager } from "@mikro-orm/postgresql";
import { Shop, type ShopEntity } from "../../entities";
import type { SettingsPatchT, SettingsT } from "../schemas/settings";

const viewSettings = (shop: ShopEntity): SettingsT => ({
  routingRule: shop.routingRule,
  remnantMinMm: shop.remnantMinMm ?? null,
});

export async function getSettings(em: EntityManager, shopId: string): Promise<SettingsT> {
  return viewSettings(await em.findOneOrFail(Shop, { id: shopId }));
}

export async function updateSettings(em: EntityManager, shopId: string, patch: SettingsPatchT): Promise<SettingsT> {
  const shop = await em.findOneOrFail(Shop, { id: shopId });
  if (patch.routingRule) shop.routingRule = patch.routingRule;
  if (patch.remnantMinMm !== undefined) shop.remnantMinMm = patch.remnantMinMm;
  await em.flush();
  return viewSettings(shop);
}
