"use client";

import { useRouter } from "next/navigation";
import {
  createEndpointAction, eventTypesAction, resendAction, rotateSecretAction, setEnabledAction, testEndpointAction,
} from "@/app/console/webhooks/actions";
import { ActionMessage, FieldError, useConsoleForm, type ConsoleResult } from "./useConsoleForm";

function Secret({ result }: { result: ConsoleResult<{ secret?: string }> }) {
  const secret = result.data?.secret;
  return secret ? (
    <p className="mt-1 text-sm">Signing secret, shown this once: <code data-testid="webhook-secret" className="break-all rounded bg-scale-100 px-1.5 py-0.5 text-xs">{secret}</code></p>
  ) : null;
}

export function NewEndpointForm({ types }: { types: readonly string[] }) {
  const router = useRouter();
  const form = useConsoleForm(createEndpointAction, { onSuccess: () => router.refresh(), resetOnSuccess: true });
  return (
    <div className="rounded-md border border-scale-200 bg-white p-4">
      <h2 className="text-sm font-semibold">New endpoint</h2>
      <form ref={form.formRef} onSubmit={form.onSubmit} className="mt-3 grid gap-3 text-sm" noValidate>
        <label className="grid gap-1">URL
          <input name="url" required placeholder="https://erp.example/hooks/shearwire" aria-describedby="endpoint-url-error" className="rounded border border-scale-300 px-2 py-1.5" />
          <FieldError id="endpoint-url-error" message={form.error("url")} />
        </label>
        <label className="grid gap-1">Description
          <input name="description" maxLength={200} className="rounded border border-scale-300 px-2 py-1.5" />
          <FieldError message={form.error("description")} />
        </label>
        <fieldset className="grid grid-cols-2 gap-1">
          <legend className="mb-1">Events (none ticked = all)</legend>
          {types.map((t) => <label key={t} className="flex items-center gap-1.5 font-mono text-xs"><input type="checkbox" name="eventTypes" value={t} /> {t}</label>)}
        </fieldset>
        <button disabled={form.pending} className="justify-self-start rounded-md bg-ink px-3 py-1.5 font-medium text-scale-50 hover:bg-ink-soft disabled:opacity-60">Add endpoint</button>
      </form>
      <div className="mt-2"><ActionMessage result={form.result} shownFields={["url", "description"]} /></div>
      <Secret result={form.result} />
    </div>
  );
}

/** Change which event types an endpoint receives. */
export function FilterForm({ id, types, chosen }: { id: string; types: readonly string[]; chosen: string[] }) {
  const router = useRouter();
  const form = useConsoleForm(eventTypesAction, { onSuccess: () => router.refresh() });
  return (
    <details className="mt-2 text-sm">
      <summary className="cursor-pointer text-xs text-edge">Change the event types</summary>
      <form ref={form.formRef} onSubmit={form.onSubmit} className="mt-2 grid grid-cols-2 gap-1 sm:grid-cols-3">
        <input type="hidden" name="id" value={id} />
        {types.map((t) => <label key={t} className="flex items-center gap-1.5 font-mono text-xs"><input type="checkbox" name="eventTypes" value={t} defaultChecked={chosen.includes(t)} /> {t}</label>)}
        <button disabled={form.pending} className="col-span-full justify-self-start rounded border border-scale-300 px-2 py-1 text-xs">Save event types (none = all)</button>
      </form>
      <ActionMessage result={form.result} />
    </details>
  );
}

function EndpointButton({ action, id, extra = {}, children }: {
  action: (input: FormData) => Promise<ConsoleResult<{ secret?: string; message?: string }> | undefined>;
  id: string; extra?: Record<string, string>; children: string;
}) {
  const router = useRouter();
  const form = useConsoleForm(action, { onSuccess: () => router.refresh() });
  return (
    <div>
      <form onSubmit={form.onSubmit}>
        <input type="hidden" name="id" value={id} />
        {Object.entries(extra).map(([k, v]) => <input key={k} type="hidden" name={k} value={v} />)}
        <button disabled={form.pending} className="rounded border border-scale-300 px-2 py-1 text-xs hover:border-ink">{children}</button>
      </form>
      <ActionMessage result={form.result} />
      <Secret result={form.result} />
    </div>
  );
}

export function EndpointButtons({ id, enabled, manage, test }: { id: string; enabled: boolean; manage: boolean; test: boolean }) {
  return (
    <div className="flex flex-wrap gap-1">
      {test && enabled && <EndpointButton action={testEndpointAction} id={id}>Send test event</EndpointButton>}
      {manage && <EndpointButton action={setEnabledAction} id={id} extra={{ enabled: String(!enabled) }}>{enabled ? "Disable" : "Enable"}</EndpointButton>}
      {manage && <EndpointButton action={rotateSecretAction} id={id}>Rotate secret</EndpointButton>}
    </div>
  );
}

export function ResendButton({ endpoint, event }: { endpoint: string; event: string }) {
  const router = useRouter();
  const form = useConsoleForm(resendAction, { onSuccess: () => router.refresh() });
  return (
    <form onSubmit={form.onSubmit}>
      <input type="hidden" name="id" value={endpoint} />
      <input type="hidden" name="event" value={event} />
      <button disabled={form.pending} className="text-xs text-edge hover:underline">Resend</button>
      <ActionMessage result={form.result} />
    </form>
  );
}
