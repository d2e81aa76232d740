import Link from "next/link";

export default function NotFound() {
  return (
    <div className="max-w-xl text-sm">
      <h1 className="text-xl font-semibold">Not found</h1>
      <p className="mt-1 text-ink-muted">
        The console has no page at this address, or nothing with that id exists in this shop.
      </p>
      <Link href="/console" className="mt-3 inline-block text-edge hover:underline">
        Back to the overview
      </Link>
    </div>
  );
}
