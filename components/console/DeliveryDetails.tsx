import { when } from "@/components/ui";
import type { DeliveryT } from "@/lib/schemas/webhook";

/**
 * A delivery's attempts, each opening to what was sent (the headers, signature included, and
 * the body, which is the event's payload: the same on every attempt) and what came back.
 */
export function DeliveryDetails({ delivery, payload }: { delivery: DeliveryT; payload: string }) {
  if (!delivery.attemptLog.length)
    return (
      <p className="text-xs text-ink-muted">
        Not attempted yet{delivery.nextAttemptAt ? `; first try ${when(delivery.nextAttemptAt)}` : ""}.
      </p>
    );
  let pretty = payload;
  try {
    pretty = JSON.stringify(JSON.parse(payload), null, 2);
  } catch {
    /* shown as sent */
  }
  return (
    <div className="space-y-1">
      {delivery.attemptLog.map((attempt, index) => (
        <details key={attempt.id} className="rounded border border-scale-200 bg-scale-50 text-xs" data-testid="attempt">
          <summary className="cursor-pointer px-2 py-1">
            Attempt {index + 1} · {when(attempt.attemptedAt)} ·{" "}
            {attempt.statusCode !== null ? `HTTP ${attempt.statusCode}` : (attempt.error ?? "no answer")} ·{" "}
            {attempt.latencyMs} ms
          </summary>
          <div className="grid gap-2 px-2 pb-2 lg:grid-cols-2">
            <section>
              <h4 className="font-semibold">Request</h4>
              <p className="font-mono">POST</p>
              <dl className="font-mono">
                {Object.entries(attempt.requestHeaders ?? {}).map(([name, value]) => (
                  <div key={name} className="break-all">
                    <dt className="inline text-ink-muted">{name}: </dt>
                    <dd className="inline">{value}</dd>
                  </div>
                ))}
                {!attempt.requestHeaders && (
                  <div className="text-ink-muted">(headers not recorded for attempts made before they were kept)</div>
                )}
              </dl>
              <pre tabIndex={0} className="mt-1 max-h-64 overflow-auto rounded bg-white p-2">
                {pretty}
              </pre>
            </section>
            <section>
              <h4 className="font-semibold">Response</h4>
              <p className="font-mono">
                {attempt.statusCode !== null
                  ? `HTTP ${attempt.statusCode}`
                  : `no response: ${attempt.error ?? "unknown error"}`}
              </p>
              <dl className="font-mono">
                {Object.entries(attempt.responseHeaders ?? {}).map(([name, value]) => (
                  <div key={name} className="break-all">
                    <dt className="inline text-ink-muted">{name}: </dt>
                    <dd className="inline">{value}</dd>
                  </div>
                ))}
              </dl>
              {attempt.responseExcerpt !== null && (
                <pre
                  tabIndex={0}
                  className="mt-1 max-h-64 overflow-auto whitespace-pre-wrap break-all rounded bg-white p-2"
                >
                  {attempt.responseExcerpt}
                </pre>
              )}
            </section>
          </div>
        </details>
      ))}
    </div>
  );
}
