"use client";

import Link from "next/link";
import { usePathname } from "next/navigation";
import { canReadAnyAudit } from "@/lib/contracts/audit";
import type { LabRole } from "@/lib/contracts/roles";
import { useLabs } from "@/lib/query/labs";

export const NAV_ITEMS = [
  { href: "/parameter-sets", label: "Parameter sets" },
  { href: "/materials", label: "Materials" },
  { href: "/workbench", label: "Workbench" },
  { href: "/measurement-sets", label: "Measurements" },
  { href: "/planner", label: "Planner" },
  { href: "/lab-runs", label: "Lab runs" },
  { href: "/lab", label: "Lab" },
  { href: "/audit", label: "Audit", auditReaders: true },
  { href: "/settings", label: "Settings" },
  { href: "/api-reference", label: "API" },
] as const;

function isActive(pathname: string, href: string): boolean {
  return pathname === href || pathname.startsWith(`${href}/`);
}

type NavItem = (typeof NAV_ITEMS)[number];

/** The menu entries this person can open: Audit only for someone who may read some lab's trail. */
export function visibleNavItems(roles: readonly LabRole[] | undefined): NavItem[] {
  return NAV_ITEMS.filter((item) => !("auditReaders" in item) || (roles !== undefined && canReadAnyAudit(roles)));
}

export function NavLinks() {
  const pathname = usePathname();
  const labs = useLabs();
  return (
    <ul className="flex flex-col gap-1">
      {visibleNavItems(labs.data?.map((lab) => lab.role)).map((item) => {
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
