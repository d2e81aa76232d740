import { ActionForm } from "@/components/console/ActionForm";
import { AddStockForm, AdjustStockForm } from "@/components/console/StockForms";
import { PageHeader, Table, Td } from "@/components/ui";
import { can } from "@/lib/auth/roles";
import { currentMember } from "@/lib/auth/session";
import { requestEm } from "@/lib/db/orm";
import { STOCK_KINDS, type StockKind } from "@/lib/schemas/enums";
import { listGrades } from "@/lib/services/catalog";
import { listStock } from "@/lib/services/stock";
import { archiveStockAction } from "./actions";

export const metadata = { title: "Stock" };

const KIND_WORDS: Record<StockKind, string> = { sheet: "Full sheet", remnant: "Remnant" };
const control = "rounded border border-scale-300 px-2 py-1.5";

export default async function Stock({
  searchParams,
}: {
  searchParams: Promise<{ grade?: string; thickness?: string; kind?: string }>;
}) {
  const member = await currentMember();
  const em = await requestEm();
  const query = await searchParams;
  const thickness = Number(query.thickness);
  const kind = STOCK_KINDS.find((k) => k === query.kind);
  const grade = query.grade?.slice(0, 50) || undefined;
  const [stock, grades] = await Promise.all([
    listStock(em, member.shopId, {
      limit: 200,
      grade,
      thicknessMm: query.thickness && thickness > 0 ? thickness : undefined,
      kind,
    }),
    listGrades(em, member.shopId, { limit: 200 }),
  ]);
  const codes = grades.data.map((g) => g.code);
  const manage = can(member.role, "stock:manage");
  return (
    <>
      <PageHeader
        title="Stock"
        lead="Full sheets and remnants on the racks; sheets reserved for programs are not offered to anything else."
      />
      <form method="get" className="mb-4 flex flex-wrap items-end gap-3 text-sm" aria-label="Filter stock">
        <label className="grid gap-1">
          Grade
          <select name="grade" defaultValue={grade ?? ""} className={control}>
            <option value="">Any grade</option>
            {codes.map((c) => (
              <option key={c}>{c}</option>
            ))}
          </select>
        </label>
        <label className="grid gap-1">
          Thickness (mm)
          <input
            name="thickness"
            defaultValue={query.thickness ?? ""}
            inputMode="decimal"
            className={`${control} w-28`}
          />
        </label>
        <label className="grid gap-1">
          Kind
          <select name="kind" defaultValue={kind ?? ""} className={control}>
            <option value="">Sheets and remnants</option>
            {STOCK_KINDS.map((stockKind) => (
              <option key={stockKind} value={stockKind}>
                {KIND_WORDS[stockKind]}
              </option>
            ))}
          </select>
        </label>
        <button className="rounded-md border border-scale-300 px-3 py-1.5">Filter</button>
      </form>
      <div className="grid gap-6 2xl:grid-cols-[1fr_28rem]">
        <Table
          head={[
            "Kind",
            "Grade",
            "Thickness",
            "Size (mm)",
            "On hand",
            "Reserved",
            "Available",
            "Location",
            "From",
            ...(manage ? ["Change"] : []),
          ]}
          empty="No stock matches."
        >
          {stock.data.map((item) => {
            const label = `${item.grade} ${item.thicknessMm} mm ${item.lengthMm} × ${item.widthMm}`;
            return (
              <tr key={item.id} data-testid="stock-row">
                <Td className="whitespace-nowrap">{KIND_WORDS[item.kind]}</Td>
                <Td mono>{item.grade}</Td>
                <Td mono className="whitespace-nowrap">
                  {item.thicknessMm} mm
                </Td>
                <Td mono className="whitespace-nowrap">
                  {item.lengthMm} × {item.widthMm}
                </Td>
                <Td mono>{item.quantity}</Td>
                <Td mono>{item.reserved}</Td>
                <Td mono>{item.available}</Td>
                <Td>{item.location ?? "—"}</Td>
                <Td mono className="text-xs">
                  {item.sourceProgram ?? "—"}
                </Td>
                {manage && (
                  <Td>
                    <AdjustStockForm id={item.id} label={label} />
                    {item.reserved === 0 && (
                      <ActionForm
                        action={archiveStockAction}
                        fields={{ id: item.id }}
                        confirm={`Archive ${label}? It will no longer be offered to plans.`}
                        label={`Archive ${label}`}
                        buttonClassName="mt-1 text-xs text-ink-muted underline"
                      >
                        Archive
                      </ActionForm>
                    )}
                  </Td>
                )}
              </tr>
            );
          })}
        </Table>
        {manage && <AddStockForm grades={codes} />}
      </div>
    </>
  );
}
