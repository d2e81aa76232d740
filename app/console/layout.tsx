import Link from "next/link";
import type { ReactNode } from "react";
import { LogoMark } from "@/components/Logo";
import { Nav } from "@/components/console/Nav";
import { NavDrawer } from "@/components/console/NavDrawer";
import { SignOut } from "@/components/console/SignOut";
import { currentMember } from "@/lib/auth/session";
import { switchShop } from "./actions";

export const dynamic = "force-dynamic";

export default async function ConsoleLayout({ children }: { children: ReactNode }) {
  const member = await currentMember();
  return (
    <div className="min-h-screen lg:grid lg:grid-cols-[13rem_minmax(0,1fr)]">
      <a
        href="#main"
        className="sr-only z-30 rounded bg-white px-3 py-2 text-sm focus:not-sr-only focus:fixed focus:left-2 focus:top-2"
      >
        Skip to the page
      </a>
      <NavDrawer>
        <Link href="/console" className="hidden items-center gap-2 px-2 font-semibold lg:flex">
          <LogoMark size={22} /> Shearwire
        </Link>
        <form action={switchShop} className="px-2">
          <label className="text-[11px] uppercase tracking-wide text-ink-muted" htmlFor="shop">
            Shop
          </label>
          {member.shops.length > 1 ? (
            <div className="mt-1 flex gap-1">
              <select
                id="shop"
                name="shop"
                defaultValue={member.shopId}
                className="w-full rounded border border-scale-300 bg-white px-1 py-1 text-sm"
              >
                {member.shops.map((shop) => (
                  <option key={shop.id} value={shop.id}>
                    {shop.name}
                  </option>
                ))}
              </select>
              <button className="rounded border border-scale-300 px-2 text-xs">Go</button>
            </div>
          ) : (
            <p id="shop" className="mt-1 text-sm font-medium">
              {member.shopName}
            </p>
          )}
        </form>
        <Nav />
        <div className="mt-auto px-2 text-xs">
          <p className="font-medium">{member.name}</p>
          <p className="text-ink-muted">
            {member.email} · <span data-testid="role">{member.role}</span>
          </p>
          <SignOut />
        </div>
      </NavDrawer>
      <main id="main" className="min-w-0 px-4 py-4 sm:px-6 lg:px-8 lg:py-6">
        {children}
      </main>
    </div>
  );
}
