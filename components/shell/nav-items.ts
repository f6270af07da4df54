import type { Action } from "@/lib/domain/permissions";

export interface NavItem {
  href: string;
  label: string;
  action: Action;
}

/** The app's sections, in menu order; each role sees the ones its permissions allow. */
export const NAV_ITEMS: readonly NavItem[] = [
  { href: "/overview", label: "Overview", action: "overview.view" },
  { href: "/scan", label: "Scan a tag", action: "service.record" },
  { href: "/points", label: "Lube points", action: "points.read" },
  { href: "/catalogue", label: "Grease catalogue", action: "catalogue.read" },
  { href: "/compatibility", label: "Compatibility", action: "compatibility.evaluate" },
  { href: "/stock", label: "Stock", action: "stock.read" },
  { href: "/incidents", label: "Mixing incidents", action: "incidents.read" },
  { href: "/audit", label: "Audit trail", action: "audit.read" },
  { href: "/admin/users", label: "Users", action: "users.manage" },
  { href: "/admin/outbox", label: "Mail outbox", action: "mail.outbox.view" },
];
