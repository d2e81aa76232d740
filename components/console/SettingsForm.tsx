"use client";

import { useRouter } from "next/navigation";
import { settingsAction } from "@/app/console/stock/actions";
import type { SettingsT } from "@/lib/schemas/settings";
import { ActionMessage, FieldError, useConsoleForm } from "./useConsoleForm";

const input = "rounded border border-scale-300 px-2 py-1.5";

/** The shop's settings: how work that comes without a shear is given one, and the smallest offcut kept. */
export function SettingsForm({ settings }: { settings: SettingsT }) {
  const router = useRouter();
  const form = useConsoleForm(settingsAction, { onSuccess: () => router.refresh() });
  return (
    <section className="rounded-md border border-scale-200 bg-white p-4">
      <h2 className="text-sm font-semibold">Routing and remnants</h2>
      <form onSubmit={form.onSubmit} className="mt-3 grid gap-3 text-sm" noValidate>
        <label className="grid gap-1">
          Work without a shear goes to
          <select name="routingRule" defaultValue={settings.routingRule} className={input}>
            <option value="least_capacity">the shear that cuts it with the least capacity used</option>
            <option value="shortest_queue">the shear with the fewest released programs waiting</option>
          </select>
        </label>
        <label className="grid gap-1">
          Keep offcuts as remnants from (mm, both sides; empty: keep none)
          <input name="remnantMinMm" inputMode="decimal" defaultValue={settings.remnantMinMm ?? ""} className={input} />
          <FieldError message={form.error("remnantMinMm")} />
        </label>
        <button
          disabled={form.disabled}
          className="justify-self-start rounded-md bg-ink px-3 py-1.5 font-medium text-scale-50 hover:bg-ink-soft disabled:opacity-60"
        >
          Save settings
        </button>
      </form>
      <div className="mt-2">
        <ActionMessage result={form.result} shownFields={["remnantMinMm"]} />
      </div>
    </section>
  );
}
