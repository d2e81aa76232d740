import Link from "next/link";
import { AcceptInvite } from "@/components/console/AcceptInvite";
import { Logo } from "@/components/Logo";
import { requestEm } from "@/lib/db/orm";
import { findInvitation } from "@/lib/services/team";

export const metadata = { title: "Join a shop" };
export const dynamic = "force-dynamic";

export default async function Invite({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const inv = await findInvitation(await requestEm(), token);
  return (
    <main className="mx-auto max-w-sm px-6 py-16">
      <Link href="/">
        <Logo />
      </Link>
      {inv ? (
        <>
          <h1 className="mt-10 text-2xl font-semibold">Join {inv.shop.name}</h1>
          <p className="mt-1 text-sm text-ink-muted">You were invited as {inv.role}.</p>
          <AcceptInvite token={token} email={inv.email} />
        </>
      ) : (
        <>
          <h1 className="mt-10 text-2xl font-semibold">This invitation cannot be used</h1>
          <p className="mt-2 text-sm text-ink-muted">
            It was used already, withdrawn, or it expired. Ask the shop&apos;s owner for a new one.
          </p>
        </>
      )}
    </main>
  );
}
