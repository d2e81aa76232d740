/**
 * Demo data for a shop of our own invention. Every name, person, machine figure and order
 * here is made up for the demo; only the grade library comes from published minimums.
 * Idempotent: running it again leaves an existing demo shop as it is.
 */
import type { EntityManager, InferEntity, RequiredEntityData } from "@mikro-orm/postgresql";
import bcrypt from "bcryptjs";
import { Grade, Membership, Plan, Shear, Shop, User, type ShopEntity } from "../../entities";
import { processStoredPlan } from "../../lib/worker/plan-jobs";
import { planTimeLimitMs } from "../../lib/queue/plan-queue";
import { claimNext, complete, start } from "../../lib/services/gateway";
import { createKey, type Principal } from "../../lib/services/keys";
import { createPlan, writePrograms } from "../../lib/services/plans";
import { createStockItem } from "../../lib/services/stock";
import type { StockItemInputT } from "../../lib/schemas/stock";
import { releaseProgram } from "../../lib/services/programs";
import { viewPlan } from "../../lib/services/plan-views";
import { DEMO_SHEARS } from "../../lib/schemas/shear";
import type { Role } from "../../lib/schemas/enums";
import { GRADE_LIBRARY } from "../../lib/shear/grades";

export const DEMO_SHOP = { name: "Ridgeback Sheet & Plate", slug: "ridgeback" };
export const DEMO_PASSWORD = process.env.SHEARWIRE_DEMO_PASSWORD ?? "ridgeback-demo-2026";

const PEOPLE: { email: string; name: string; role: Role }[] = [
  { email: "ines.varga@ridgeback.example", name: "Ines Varga", role: "owner" },
  { email: "tomas.reyes@ridgeback.example", name: "Tomas Reyes", role: "admin" },
  { email: "priya.anand@ridgeback.example", name: "Priya Anand", role: "developer" },
  { email: "gus.holloway@ridgeback.example", name: "Gus Holloway", role: "viewer" },
];

// Two invented machines of different capacity (figures are demo values, not any real model).
const SHEARS = DEMO_SHEARS;

/** The published-minimums grade library, as catalog rows of a shop (staged; the caller flushes). */
export function addGradeLibrary(em: EntityManager, shop: ShopEntity) {
  for (const gradeProfile of GRADE_LIBRARY) {
    em.create(Grade, {
      shop,
      code: gradeProfile.code,
      name: gradeProfile.name ?? gradeProfile.code,
      family: gradeProfile.family,
      standard: gradeProfile.standard,
      yieldMpa: gradeProfile.yieldMpa,
      tensileMinMpa: gradeProfile.tensileMinMpa,
      tensileTypicalMpa: gradeProfile.tensileTypicalMpa,
      tensileMaxMpa: gradeProfile.tensileMaxMpa ?? null,
      valuesAreTypical: gradeProfile.valuesAreTypical,
      shearTensileRatio: gradeProfile.shearTensileRatio,
      gaugeFamily: gradeProfile.gaugeFamily,
      hardnessHb: gradeProfile.hardnessHb,
      note: gradeProfile.note ?? null,
    });
  }
}

export interface DemoSummary {
  shop: { id: string; name: string };
  owner: { email: string; password: string };
  shears: { id: string; name: string }[];
  grades: number;
  plan: { id: string; reference: string | null };
}

/**
 * What is on the demo shop's racks (invented): full sheets of the demo order's 3 mm A36 in two sizes, a remnant
 * kept from an earlier cut, and sheets of other grades and thicknesses the order does not draw on.
 */
const DEMO_STOCK: StockItemInputT[] = [
  { kind: "sheet", grade: "A36", thicknessMm: 3, lengthMm: 2500, widthMm: 1250, quantity: 12, location: "Rack A" },
  { kind: "sheet", grade: "A36", thicknessMm: 3, lengthMm: 3000, widthMm: 1500, quantity: 4, location: "Rack B" },
  {
    kind: "remnant",
    grade: "A36",
    thicknessMm: 3,
    lengthMm: 1250,
    widthMm: 900,
    quantity: 1,
    location: "Remnant rack",
    note: "Kept from last week's bracket run (demo).",
  },
  { kind: "sheet", grade: "A36", thicknessMm: 6, lengthMm: 2500, widthMm: 1250, quantity: 6, location: "Rack C" },
  { kind: "sheet", grade: "304", thicknessMm: 1.5, lengthMm: 2500, widthMm: 1250, quantity: 8, location: "Rack D" },
];

/** A week's order of our own invention for the demo shop: 3 mm A36 cabinet parts, planned on Bay 1 from the racks. */
const DEMO_PLAN = {
  reference: "RB-W49-A36-3",
  title: "Week 49 cabinet parts, 3 mm A36 (demo order)",
  grade: "A36",
  thickness: { value: 3 },
  units: "mm" as const,
  stock: "on_hand" as const,
  blanks: [
    { label: "cabinet side", length: 900, width: 450, quantity: 16, canTurn: false },
    { label: "shelf", length: 860, width: 380, quantity: 24 },
    { label: "back panel", length: 860, width: 600, quantity: 8 },
    { label: "door skin", length: 700, width: 420, quantity: 16, canTurn: false },
    { label: "gusset", length: 150, width: 150, quantity: 64 },
    { label: "kick plate", length: 860, width: 100, quantity: 8 },
  ],
  options: { objective: "fewest_sheets" as const, trim: 5, reusableOffcut: { length: 500, width: 300 } },
};

export async function seedDemo(em: EntityManager): Promise<DemoSummary> {
  const summary = await em.transactional(async (tx) => {
    let shop = await tx.findOne(Shop, { slug: DEMO_SHOP.slug });
    if (!shop) {
      shop = tx.create(Shop, DEMO_SHOP);
      const hash = await bcrypt.hash(DEMO_PASSWORD, 10);
      for (const person of PEOPLE) {
        const user =
          (await tx.findOne(User, { email: person.email })) ??
          tx.create(User, { email: person.email, name: person.name, passwordHash: hash });
        tx.create(Membership, { user, shop, role: person.role });
      }
      for (const shear of SHEARS)
        tx.create(Shear, { ...(shear as Omit<RequiredEntityData<InferEntity<typeof Shear>>, "shop">), shop });
      addGradeLibrary(tx, shop);
      await tx.flush();
      for (const item of DEMO_STOCK) await createStockItem(tx, shop.id, item);
    }
    const shears = await tx.find(Shear, { shop }, { orderBy: { name: "asc" } });
    return {
      shop: { id: shop.id, name: shop.name },
      owner: { email: PEOPLE[0].email, password: DEMO_PASSWORD },
      shears: shears.map((s) => ({ id: s.id, name: s.name })),
      grades: await tx.count(Grade, { shop }),
    };
  });
  const existing = await em.findOne(Plan, { shop: summary.shop.id }, { orderBy: { id: "asc" } });
  const plan = existing
    ? viewPlan(existing)
    : await createPlan(em, summary.shop.id, { ...DEMO_PLAN, shear: summary.shears[0].id }, { queue: false });
  if (plan.status === "queued") {
    // This script is not the web server: it may plan right here, so the demo plan is ready when the console opens.
    await processStoredPlan(() => em.fork(), plan.id, planTimeLimitMs());
  }
  if (!existing) await setDemoWorkGoing(em, summary.shop.id, plan.id, summary.shears[0]);
  return { ...summary, plan: { id: plan.id, reference: plan.reference } };
}

/**
 * The demo plan's programs written and set going, so the console shows work at every stage:
 * the first run to the end by the demo gateway of the first shear, the second released and
 * waiting for it, the rest drafts.
 */
async function setDemoWorkGoing(
  em: EntityManager,
  shopId: string,
  planId: string,
  shear: { id: string; name: string },
) {
  const shearId = shear.id;
  const dueAt = new Date(Date.now() + 3 * 24 * 3600 * 1000).toISOString();
  const { data: programs } = await writePrograms(em.fork(), shopId, planId, { dueAt });
  const release = (index: number) => {
    const program = programs[index];
    const warnings = (program?.check.findings ?? []).filter((f) => f.severity === "warning").map((f) => f.code);
    return program && program.validation !== "fail" ? releaseProgram(em.fork(), shopId, program.id, warnings) : null;
  };
  if (!(await release(0))) return;
  const { key } = await createKey(em.fork(), shopId, {
    name: `Gateway beside ${shear.name} (demo)`,
    scopes: ["gateway"],
    shearIds: [shearId],
  });
  const gateway: Principal = { keyId: key.id, shopId, scopes: ["gateway"], shearIds: [shearId], rateLimitPerMin: null };
  const claimed = await claimNext(em.fork(), gateway, shearId, { waitSeconds: 0 });
  if (claimed) {
    const { program } = claimed;
    await start(em.fork(), gateway, program.id);
    await complete(em.fork(), gateway, program.id, {
      goodPieces: program.check.yield?.total.blanks ?? 0,
      scrappedPieces: 0,
      sheetsUsed: program.sheet.count,
      notes: "Demo run: every blank good.",
    });
  }
  await release(1);
}
