"use client";

import Link from "next/link";
import { usePathname } from "next/navigation";

export const NAV_ITEMS = [
  { href: "/parameter-sets", label: "Parameter sets" },
  { href: "/materials", label: "Materials" },
  { href: "/workbench", label: "Workbench" },
  { href: "/measurement-sets", label: "Measurements" },
  { href: "/planner", label: "Planner" },
  { href: "/lab-runs", label: "Lab runs" },
  { href: "/lab", label: "Lab" },
  { href: "/audit", label: "Audit" },
  { href: "/settings", label: "Settings" },
] as const;

function isActive(pathname: string, href: string): boolean {
  return pathname === href || pathname.startsWith(`${href}/`);
}

export function NavLinks() {
  const pathname = usePathname();
  return (
    <ul className="flex flex-col gap-1">
      {NAV_ITEMS.map((item) => {
        const active = isActive(pathname, item.href);
        return (
          <li key={item.href}>
            <Link
              href={item.href}
              aria-current={active ? "page" : undefined}
              className={`block rounded-md border-l-2 px-3 py-2 text-sm whitespace-nowrap transition-colors ${
                active
                  ? "border-lux bg-lux-light font-semibold text-lux-dark"
                  : "border-transparent text-ink-soft hover:bg-paper-sunk hover:text-ink"
              }`}
            >
              {item.label}
            </Link>
          </li>
        );
      })}
    </ul>
  );
}
