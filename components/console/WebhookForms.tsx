"use client";

import { useActionState } from "react";
import { createEndpointAction, endpointAction, type HookState } from "@/app/console/webhooks/actions";

function Result({ state }: { state: HookState }) {
  if (!state) return null;
  return (
    <div className="mt-2 space-y-1 text-sm">
      {state.ok && <p role="status" className="text-ok">{state.ok}</p>}
      {state.secret && (
        <p>Signing secret, shown this once: <code data-testid="webhook-secret" className="break-all rounded bg-scale-100 px-1.5 py-0.5 text-xs">{state.secret}</code></p>
      )}
      {state.error && <p role="alert" className="text-fault">{state.error}</p>}
    </div>
  );
}

export function NewEndpointForm({ types }: { types: readonly string[] }) {
  const [state, act, pending] = useActionState<HookState, FormData>(createEndpointAction, null);
  return (
    <div className="rounded-md border border-scale-200 bg-white p-4">
      <h2 className="text-sm font-semibold">New endpoint</h2>
      <form action={act} className="mt-3 grid gap-3 text-sm">
        <label className="grid gap-1">URL <input name="url" required placeholder="https://erp.example/hooks/shearwire" className="rounded border border-scale-300 px-2 py-1.5" /></label>
        <label className="grid gap-1">Description <input name="description" maxLength={200} className="rounded border border-scale-300 px-2 py-1.5" /></label>
        <fieldset className="grid grid-cols-2 gap-1">
          <legend className="mb-1">Events (none ticked = all)</legend>
          {types.map((t) => <label key={t} className="flex items-center gap-1.5 font-mono text-xs"><input type="checkbox" name="eventTypes" value={t} /> {t}</label>)}
        </fieldset>
        <button disabled={pending} className="justify-self-start rounded-md bg-ink px-3 py-1.5 font-medium text-scale-50 hover:bg-ink-soft disabled:opacity-60">Add endpoint</button>
      </form>
      <Result state={state} />
    </div>
  );
}

/** Change which event types an endpoint receives. */
export function FilterForm({ id, types, chosen }: { id: string; types: readonly string[]; chosen: string[] }) {
  const [state, act, pending] = useActionState<HookState, FormData>(endpointAction, null);
  return (
    <details className="mt-2 text-sm">
      <summary className="cursor-pointer text-xs text-edge">Change the event types</summary>
      <form action={act} className="mt-2 grid grid-cols-2 gap-1 sm:grid-cols-3">
        <input type="hidden" name="id" value={id} />
        <input type="hidden" name="action" value="filter" />
        {types.map((t) => <label key={t} className="flex items-center gap-1.5 font-mono text-xs"><input type="checkbox" name="eventTypes" value={t} defaultChecked={chosen.includes(t)} /> {t}</label>)}
        <button disabled={pending} className="col-span-full justify-self-start rounded border border-scale-300 px-2 py-1 text-xs">Save event types (none = all)</button>
      </form>
      <Result state={state} />
    </details>
  );
}

export function EndpointButtons({ id, enabled, manage, test }: { id: string; enabled: boolean; manage: boolean; test: boolean }) {
  const [state, act, pending] = useActionState<HookState, FormData>(endpointAction, null);
  const button = (action: string, label: string) => (
    <form action={act}>
      <input type="hidden" name="id" value={id} />
      <input type="hidden" name="action" value={action} />
      <button disabled={pending} className="rounded border border-scale-300 px-2 py-1 text-xs hover:border-ink">{label}</button>
    </form>
  );
  return (
    <div>
      <div className="flex flex-wrap gap-1">
        {test && enabled && button("test", "Send test event")}
        {manage && button(enabled ? "disable" : "enable", enabled ? "Disable" : "Enable")}
        {manage && button("rotate", "Rotate secret")}
      </div>
      <Result state={state} />
    </div>
  );
}

export function ResendButton({ endpoint, event }: { endpoint: string; event: string }) {
  const [state, act, pending] = useActionState<HookState, FormData>(endpointAction, null);
  return (
    <form action={act}>
      <input type="hidden" name="id" value={endpoint} />
      <input type="hidden" name="event" value={event} />
      <input type="hidden" name="action" value="resend" />
      <button disabled={pending} className="text-xs text-edge hover:underline">Resend</button>
      {state?.error && <span className="ml-1 text-xs text-fault">{state.error}</span>}
      {state?.ok && <span className="ml-1 text-xs text-ok">{state.ok}</span>}
    </form>
  );
}
