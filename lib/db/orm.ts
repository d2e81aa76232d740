import { MikroORM, type EntityManager } from "@mikro-orm/postgresql";
import { ormConfig } from "./config";

type Holder = { orm?: Promise<MikroORM> };
// Survives module reloads in development so one process keeps one pool.
const holder = globalThis as unknown as { __shearwireOrm?: Holder };
const state: Holder = (holder.__shearwireOrm ??= {});

/** The process-wide ORM, created on first use. */
export function getOrm(): Promise<MikroORM> {
  state.orm ??= MikroORM.init(ormConfig()).catch((err) => {
    state.orm = undefined;
    throw err;
  });
  return state.orm;
}

/** A fresh entity manager for one request or job: never share one between requests. */
export async function requestEm(): Promise<EntityManager> {
  return (await getOrm()).em.fork();
}
