export default function Loading() {
  return (
    <div role="status" aria-live="polite" className="animate-pulse space-y-3">
      <div className="h-6 w-48 rounded bg-scale-200" />
      <div className="h-4 w-96 rounded bg-scale-200" />
      <div className="h-40 rounded bg-scale-100" />
      <span className="sr-only">Loading…</span>
    </div>
  );
}
