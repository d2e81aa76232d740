"use client";

import Link from "next/link";
import { usePathname } from "next/navigation";
import { useState, type ReactNode } from "react";
import { LogoMark } from "@/components/Logo";

/**
 * The console's navigation: a sidebar on wide screens; below them a bar with a Menu button
 * that opens the same navigation over the page (closed again on every page change).
 */
export function NavDrawer({ children }: { children: ReactNode }) {
  const path = usePathname();
  // Open only on the page it was opened on: a page change closes it without an effect.
  const [openOn, setOpenOn] = useState<string | null>(null);
  const open = openOn === path;
  return (
    <>
      <div className="sticky top-0 z-20 flex items-center justify-between border-b border-scale-200 bg-scale-100 px-4 py-2 lg:hidden">
        <Link href="/console" className="flex items-center gap-2 font-semibold">
          <LogoMark size={20} /> Shearwire
        </Link>
        <button
          type="button"
          aria-expanded={open}
          aria-controls="console-navigation"
          onClick={() => setOpenOn(open ? null : path)}
          className="rounded border border-scale-300 bg-white px-3 py-1 text-sm"
        >
          {open ? "Close" : "Menu"}
        </button>
      </div>
      <aside
        id="console-navigation"
        aria-label="Console navigation"
        className={`${open ? "flex" : "hidden"} flex-col gap-6 border-r border-scale-200 bg-scale-100 px-3 py-4 lg:sticky lg:top-0 lg:flex lg:h-screen lg:overflow-y-auto`}
      >
        {children}
      </aside>
    </>
  );
}
