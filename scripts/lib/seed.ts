import type { EntityManager } from "@mikro-orm/postgresql";
export async function seedDemo(_em: EntityManager) { return {}; }
