/** What each role in a shop may do in the console. Checked on the server for every page and action. */
import type { Role } from "../../lib/schemas/enums";

export const ROLE_RANK: Record<Role, number> = { viewer: 0, developer: 1, admin: 2, owner: 3 };

export const PERMISSIONS = {
  read: "viewer",
  "webhooks:test": "developer",
  "keys:create-read-only": "developer",
  "keys:manage": "admin",
  "webhooks:manage": "admin",
  "catalog:manage": "admin",
  "stock:manage": "admin",
  "settings:manage": "admin",
  "programs:release": "admin",
  "programs:write": "admin",
  "team:manage": "owner",
} as const satisfies Record<string, Role>;

export type Permission = keyof typeof PERMISSIONS;

export function can(role: Role, permission: Permission): boolean {
  return ROLE_RANK[role] >= ROLE_RANK[PERMISSIONS[permission]];
}
