import Link from "next/link";
import type { ReactNode } from "react";
import { archiveAction } from "@/app/console/catalog-actions";
import { ActionForm } from "@/components/console/ActionForm";
import { PageHeader } from "@/components/ui";

/**
 * One page for a catalog entry (a shear or a grade): the way back to its list, its name and
 * id, archiving for those who manage the catalog, and its form, or for everyone else its
 * fields read-only.
 */
export function CatalogDetail({
  back,
  title,
  id,
  archivedAt,
  manage,
  archiveConfirm,
  form,
  fields,
}: {
  back: { href: string; label: string };
  title: string;
  id: string;
  archivedAt: string | null | undefined;
  manage: boolean;
  archiveConfirm: string;
  form: ReactNode;
  fields: Record<string, unknown>;
}) {
  return (
    <>
      <p className="mb-1 text-xs">
        <Link href={back.href} className="text-edge hover:underline">
          ← {back.label}
        </Link>
      </p>
      <PageHeader
        title={title}
        lead={
          <span className="font-mono text-xs">
            {id}
            {archivedAt ? " · archived" : ""}
          </span>
        }
      >
        {manage && !archivedAt && (
          <ActionForm
            action={archiveAction}
            fields={{ id }}
            confirm={archiveConfirm}
            buttonClassName="rounded border border-fault/50 px-2 py-1 text-xs text-fault"
          >
            Archive
          </ActionForm>
        )}
      </PageHeader>
      <section className="max-w-2xl rounded-md border border-scale-200 bg-white p-4">
        {manage ? (
          form
        ) : (
          <dl className="grid grid-cols-1 gap-x-4 gap-y-1 text-sm sm:grid-cols-[max-content_1fr]">
            {Object.entries(fields)
              .filter(([, value]) => value !== null && value !== undefined && value !== "")
              .map(([name, value]) => (
                <div key={name} className="contents">
                  <dt className="font-mono text-xs text-ink-muted sm:py-0.5">{name}</dt>
                  <dd className="break-words pb-1 font-mono text-xs sm:py-0.5">
                    {typeof value === "object" ? JSON.stringify(value) : String(value)}
                  </dd>
                </div>
              ))}
          </dl>
        )}
      </section>
    </>
  );
}
