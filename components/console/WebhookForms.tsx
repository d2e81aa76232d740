"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import {
  createEndpointAction,
  resendAction,
  rotateSecretAction,
  setEnabledAction,
  testEndpointAction,
  updateEndpointAction,
} from "@/app/console/webhooks/actions";
import { ActionMessage, FieldError, useConsoleForm, type ConsoleResult } from "./useConsoleForm";

function Secret({ result }: { result: ConsoleResult<{ secret?: string }> }) {
  const secret = result.data?.secret;
  const [copied, setCopied] = useState(false);
  return secret ? (
    <div className="mt-1 text-sm">
      <p>Signing secret, shown this once: copy it into the receiver to verify signatures.</p>
      <div className="mt-1 flex items-center gap-2">
        <code data-testid="webhook-secret" className="flex-1 break-all rounded bg-scale-100 px-1.5 py-0.5 text-xs">
          {secret}
        </code>
        <button
          type="button"
          onClick={async () => {
            await navigator.clipboard?.writeText(secret);
            setCopied(true);
          }}
          className="rounded border border-scale-300 px-2 py-0.5 text-xs"
        >
          {copied ? "Copied" : "Copy"}
        </button>
      </div>
    </div>
  ) : null;
}

/** The event types to tick, each with what it says. */
function EventTypeBoxes({
  types,
  words,
  chosen = [],
}: {
  types: readonly string[];
  words: Record<string, string>;
  chosen?: string[];
}) {
  return (
    <fieldset className="grid gap-1">
      <legend className="mb-1">Events (none ticked = every event)</legend>
      {types.map((eventType) => (
        <label key={eventType} className="flex items-start gap-1.5 text-xs">
          <input
            type="checkbox"
            name="eventTypes"
            value={eventType}
            defaultChecked={chosen.includes(eventType)}
            className="mt-0.5"
          />
          <span>
            <span className="font-mono">{eventType}</span> <span className="text-ink-muted">· {words[eventType]}</span>
          </span>
        </label>
      ))}
    </fieldset>
  );
}

export function NewEndpointForm({ types, words }: { types: readonly string[]; words: Record<string, string> }) {
  const router = useRouter();
  const form = useConsoleForm(createEndpointAction, { onSuccess: () => router.refresh(), resetOnSuccess: true });
  return (
    <div className="rounded-md border border-scale-200 bg-white p-4">
      <h2 className="text-sm font-semibold">New endpoint</h2>
      <form onSubmit={form.onSubmit} className="mt-3 grid gap-3 text-sm" noValidate>
        <label className="grid gap-1">
          URL
          <input
            name="url"
            required
            placeholder="https://erp.example/hooks/shearwire"
            aria-describedby="endpoint-url-error"
            className="rounded border border-scale-300 px-2 py-1.5"
          />
          <FieldError id="endpoint-url-error" message={form.error("url")} />
        </label>
        <label className="grid gap-1">
          Description
          <input name="description" maxLength={200} className="rounded border border-scale-300 px-2 py-1.5" />
          <FieldError message={form.error("description")} />
        </label>
        <EventTypeBoxes types={types} words={words} />
        <button
          disabled={form.disabled}
          className="justify-self-start rounded-md bg-ink px-3 py-1.5 font-medium text-scale-50 hover:bg-ink-soft disabled:opacity-60"
        >
          Add endpoint
        </button>
      </form>
      <div className="mt-2">
        <ActionMessage result={form.result} shownFields={["url", "description"]} />
      </div>
      <Secret result={form.result} />
    </div>
  );
}

/** Change an endpoint: its address, description and event types. */
export function EditEndpointForm({
  endpoint,
  types,
  words,
}: {
  endpoint: { id: string; url: string; description: string | null; eventTypes: string[] };
  types: readonly string[];
  words: Record<string, string>;
}) {
  const router = useRouter();
  const form = useConsoleForm(updateEndpointAction, { onSuccess: () => router.refresh() });
  return (
    <div className="rounded-md border border-scale-200 bg-white p-4">
      <h2 className="text-sm font-semibold">Settings</h2>
      <form onSubmit={form.onSubmit} className="mt-3 grid gap-3 text-sm" noValidate>
        <input type="hidden" name="id" value={endpoint.id} />
        <label className="grid gap-1">
          URL
          <input
            name="url"
            required
            defaultValue={endpoint.url}
            aria-describedby="edit-url-error"
            className="rounded border border-scale-300 px-2 py-1.5"
          />
          <FieldError id="edit-url-error" message={form.error("url")} />
        </label>
        <label className="grid gap-1">
          Description
          <input
            name="description"
            maxLength={200}
            defaultValue={endpoint.description ?? ""}
            className="rounded border border-scale-300 px-2 py-1.5"
          />
          <FieldError message={form.error("description")} />
        </label>
        <EventTypeBoxes types={types} words={words} chosen={endpoint.eventTypes} />
        <button
          disabled={form.disabled}
          className="justify-self-start rounded-md bg-ink px-3 py-1.5 font-medium text-scale-50 hover:bg-ink-soft disabled:opacity-60"
        >
          Save
        </button>
        <ActionMessage result={form.result} shownFields={["url", "description"]} />
      </form>
    </div>
  );
}

function EndpointButton({
  action,
  id,
  extra = {},
  children,
}: {
  action: (input: FormData) => Promise<ConsoleResult<{ secret?: string; message?: string }> | undefined>;
  id: string;
  extra?: Record<string, string>;
  children: string;
}) {
  const router = useRouter();
  const form = useConsoleForm(action, { onSuccess: () => router.refresh() });
  return (
    <div>
      <form onSubmit={form.onSubmit}>
        <input type="hidden" name="id" value={id} />
        {Object.entries(extra).map(([field, value]) => (
          <input key={field} type="hidden" name={field} value={value} />
        ))}
        <button disabled={form.disabled} className="rounded border border-scale-300 px-2 py-1 text-xs hover:border-ink">
          {children}
        </button>
      </form>
      <ActionMessage result={form.result} />
      <Secret result={form.result} />
    </div>
  );
}

export function EndpointButtons({
  id,
  enabled,
  manage,
  test,
}: {
  id: string;
  enabled: boolean;
  manage: boolean;
  test: boolean;
}) {
  return (
    <div className="flex flex-wrap gap-1">
      {test && enabled && (
        <EndpointButton action={testEndpointAction} id={id}>
          Send test event
        </EndpointButton>
      )}
      {manage && (
        <EndpointButton action={setEnabledAction} id={id} extra={{ enabled: String(!enabled) }}>
          {enabled ? "Disable" : "Enable"}
        </EndpointButton>
      )}
      {manage && (
        <EndpointButton action={rotateSecretAction} id={id}>
          Rotate secret
        </EndpointButton>
      )}
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
      <button disabled={form.disabled} className="text-xs text-edge hover:underline">
        Resend
      </button>
      <ActionMessage result={form.result} />
    </form>
  );
}
