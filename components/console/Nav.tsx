"use client";

import Link from "next/link";
import { usePathname } from "next/navigation";

const ITEMS = [
  { href: "/console", label: "Overview" },
  { href: "/console/programs", label: "Programs" },
  { href: "/console/plans", label: "Plans" },
  { href: "/console/stock", label: "Stock" },
  { href: "/console/upload", label: "Upload" },
  { href: "/console/keys", label: "API keys" },
  { href: "/console/webhooks", label: "Webhooks" },
  { href: "/console/events", label: "Events" },
  { href: "/console/logs", label: "Request log" },
  { href: "/console/shears", label: "Shears" },
  { href: "/console/grades", label: "Grades" },
  { href: "/console/team", label: "Team" },
];

export function Nav() {
  const path = usePathname();
  return (
    <nav aria-label="Console" className="flex flex-col gap-0.5 text-sm">
      {ITEMS.map((item) => {
        const active = item.href === "/console" ? path === item.href : path.startsWith(item.href);
        return (
          <Link
            key={item.href}
            href={item.href}
            aria-current={active ? "page" : undefined}
            className={`rounded px-2 py-1.5 ${active ? "bg-ink text-scale-50" : "text-ink-soft hover:bg-scale-200"}`}
          >
            {item.label}
          </Link>
        );
      })}
      <a href="/docs" className="mt-3 rounded px-2 py-1.5 text-ink-soft hover:bg-scale-200">
        API reference ↗
      </a>
    </nav>
  );
}
