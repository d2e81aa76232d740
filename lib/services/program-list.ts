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

export async function listPrograms(em: EntityManager, shopId: string, programFilter: ProgramFilter) {
  const where: FilterQuery<ProgramEntity> = {
    shop: shopId,
    ...(programFilter.status ? { status: programFilter.status } : {}),
    ...(programFilter.shear ? { shear: programFilter.shear } : {}),
    ...(programFilter.reference ? { reference: programFilter.reference } : {}),
    ...(programFilter.search
      ? {
          $or: [
            { reference: { $ilike: containing(programFilter.search) } },
            { title: { $ilike: containing(programFilter.search) } },
          ],
        }
      : {}),
    ...((programFilter.updatedSince ?? programFilter.updated_since)
      ? { updatedAt: { $gte: new Date((programFilter.updatedSince ?? programFilter.updated_since)!) } }
      : {}),
  };
  return findPage(em, Program, where, programFilter, viewProgram);
}
