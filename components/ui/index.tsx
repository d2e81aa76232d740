import type { ReactNode } from "react";

export function PageHeader({ title, children, lead }: { title: string; lead?: ReactNode; children?: ReactNode }) {
  return (
    <header className="mb-5 flex items-start justify-between gap-4">
      <div>
        <h1 className="text-xl font-semibold tracking-tight">{title}</h1>
        {lead && <p className="mt-0.5 text-sm text-ink-muted">{lead}</p>}
      </div>
      {children && <div className="flex items-center gap-2">{children}</div>}
    </header>
  );
}

/** Each state's badge: a background and a text colour (tests/components/badge-contrast.test.ts checks their contrast). */
export const TONES: Record<string, string> = {
  draft: "bg-scale-200 text-ink-soft",
  released: "bg-edge-light text-edge-dark",
  claimed: "bg-edge-light text-edge-dark",
  running: "bg-edge text-white",
  completed: "bg-ok-light text-ok",
  failed: "bg-fault-light text-fault",
  cancelled: "bg-scale-200 text-ink-soft line-through",
  pass: "bg-ok-light text-ok",
  warn: "bg-caution-light text-caution-dark",
  fail: "bg-fault-light text-fault",
  succeeded: "bg-ok-light text-ok",
  pending: "bg-caution-light text-caution-dark",
  // ink-soft, not ink-muted, on scale-200: 9.6:1 against 4.3:1 (WCAG AA asks 4.5:1 for text this small)
  skipped: "bg-scale-200 text-ink-soft",
  error: "bg-fault-light text-fault",
  warning: "bg-caution-light text-caution-dark",
  enabled: "bg-ok-light text-ok",
  disabled: "bg-fault-light text-fault",
  revoked: "bg-fault-light text-fault",
  active: "bg-ok-light text-ok",
  expired: "bg-scale-200 text-ink-soft",
};

export function Badge({ value, label }: { value: string; label?: string }) {
  return (
    <span className={`inline-block rounded px-1.5 py-0.5 font-mono text-[11px] ${TONES[value] ?? "bg-scale-200"}`}>
      {label ?? value}
    </span>
  );
}

export function Table({ head, children, empty }: { head: string[]; children: ReactNode; empty?: string }) {
  const rows = Array.isArray(children) ? children.length : children ? 1 : 0;
  return (
    <div className="overflow-x-auto rounded-md border border-scale-200 bg-white">
      <table className="w-full text-left text-sm">
        <thead className="border-b border-scale-200 bg-scale-50 text-[11px] uppercase tracking-wide text-ink-muted">
          <tr>
            {head.map((heading) => (
              <th key={heading} className="px-3 py-2 font-medium">
                {heading}
              </th>
            ))}
          </tr>
        </thead>
        <tbody className="divide-y divide-scale-100">{children}</tbody>
      </table>
      {rows === 0 && <p className="px-3 py-6 text-center text-sm text-ink-muted">{empty ?? "Nothing here yet."}</p>}
    </div>
  );
}

export function Td({ children, mono, className = "" }: { children?: ReactNode; mono?: boolean; className?: string }) {
  return <td className={`px-3 py-2 align-top ${mono ? "font-mono text-xs" : ""} ${className}`}>{children}</td>;
}

export function Stat({ label, value, hint }: { label: string; value: ReactNode; hint?: string }) {
  return (
    <div className="rounded-md border border-scale-200 bg-white px-4 py-3">
      <p className="text-[11px] uppercase tracking-wide text-ink-muted">{label}</p>
      <p className="mt-1 font-mono text-2xl">{value}</p>
      {hint && <p className="text-xs text-ink-muted">{hint}</p>}
    </div>
  );
}

export const when = (moment: Date | string | null | undefined) =>
  moment ? new Date(moment).toISOString().replace("T", " ").slice(0, 19) + " UTC" : "—";

/**
 * A moment as `when` writes it, in a table cell: the date and the time each kept whole, so that on a
 * narrow screen the cell breaks between them instead of pushing the columns after it out of view.
 */
export function Moment({ value }: { value: Date | string | null | undefined }) {
  if (!value) return <span className="font-mono text-xs">—</span>;
  const [date, time] = when(value).split(" ", 2);
  return (
    <time dateTime={new Date(value).toISOString()} className="font-mono text-xs">
      <span className="whitespace-nowrap">{date}</span> <span className="whitespace-nowrap">{time} UTC</span>
    </time>
  );
}
