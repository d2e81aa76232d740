/** Listing a shop's programs: filters, search and pages. */
import { type EntityManager, type FilterQuery } from "@mikro-orm/postgresql";
import { Program, type ProgramEntity } from "../../entities";
import type { ProgramStatus } from "../../entities/Program";
import { containing, findPage } from "../db/paging";
import { viewProgram } from "./program-view";

export interface ProgramFilter {
  limit: number;
  cursor?: string;
  status?: ProgramStatus;
  shear?: string;
  reference?: string;
  /** part of the reference or title, any case */
  search?: string;
  updatedSince?: string;
  /** the earlier spelling of updatedSince */
  updated_since?: string;
}

export async function listPrograms(em: EntityManager, shopId: string, f: ProgramFilter) {
  const where: FilterQuery<ProgramEntity> = {
    shop: shopId,
    ...(f.status ? { status: f.status } : {}),
    ...(f.shear ? { shear: f.shear } : {}),
    ...(f.reference ? { reference: f.reference } : {}),
    ...(f.search
      ? { $or: [{ reference: { $ilike: containing(f.search) } }, { title: { $ilike: containing(f.search) } }] }
      : {}),
    ...((f.updatedSince ?? f.updated_since)
      ? { updatedAt: { $gte: new Date((f.updatedSince ?? f.updated_since)!) } }
      : {}),
  };
  return findPage(em, Program, where, f, viewProgram);
}
