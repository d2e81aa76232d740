"use client";

export default function ConsoleError({ error, reset }: { error: Error & { digest?: string }; reset: () => void }) {
  const notAllowed = /may not do this/.test(error.message);
  return (
    <div role="alert" className="max-w-xl rounded-md border border-fault/40 bg-fault-light p-4 text-sm">
      <p className="font-semibold text-fault">{notAllowed ? "Not allowed" : "This page could not be shown"}</p>
      <p className="mt-1 text-ink-soft">
        {notAllowed
          ? error.message
          : "Something went wrong while reading it. Try again; if it keeps failing, the server log has the details."}
      </p>
      {error.digest && <p className="mt-1 font-mono text-xs text-ink-muted">reference {error.digest}</p>}
      <button onClick={reset} className="mt-3 rounded-md border border-scale-300 bg-white px-3 py-1">
        Try again
      </button>
    </div>
  );
}
