export const ROLES = ["admin", "lead", "clerk", "technician", "auditor"] as const;
export type Role = (typeof ROLES)[number];

export const ROLE_LABELS: Record<Role, string> = {
  admin: "Administrator",
  lead: "Lubrication lead",
  clerk: "Storeroom clerk",
  technician: "Lubrication technician",
  auditor: "Auditor",
};

/** Everything a signed-in person can be allowed to do. New actions are denied until the table names them. */
export const ACTIONS = [
  "overview.view",
  "catalogue.read",
  "catalogue.write",
  "compatibility.evaluate",
  "compatibility.rules.manage",
  "calculations.use",
  "points.read",
  "points.write",
  "service.record",
  "services.export",
  "stock.read",
  "stock.receive",
  "stock.issue",
  "stock.count",
  "stock.move",
  "stock.reorder.manage",
  "incidents.read",
  "incidents.report",
  "incidents.work",
  "incidents.export",
  "audit.read",
  "audit.verify",
  "users.manage",
  "sites.manage",
  "mail.outbox.view",
  "account.self",
] as const;
export type Action = (typeof ACTIONS)[number];
