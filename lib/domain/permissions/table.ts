import type { Action, Role } from "./types";

/**
 * Who may do what. One row per action; a role missing from a row is denied.
 * The auditor reads everything an auditor needs and writes nothing.
 */
export const PERMISSION_TABLE: Readonly<Record<Action, readonly Role[]>> = {
  "overview.view": ["admin", "lead", "clerk", "technician", "auditor"],
  "catalogue.read": ["admin", "lead", "clerk", "technician", "auditor"],
  "catalogue.write": ["admin", "lead"],
  "compatibility.evaluate": ["admin", "lead", "clerk", "technician", "auditor"],
  "compatibility.rules.manage": ["admin", "lead"],
  "calculations.use": ["admin", "lead", "clerk", "technician", "auditor"],
  "points.read": ["admin", "lead", "clerk", "technician", "auditor"],
  "points.write": ["admin", "lead"],
  "service.record": ["lead", "technician"],
  "services.export": ["admin", "lead", "auditor"],
  "stock.read": ["admin", "lead", "clerk", "technician", "auditor"],
  "stock.receive": ["lead", "clerk"],
  "stock.issue": ["lead", "clerk", "technician"],
  "stock.count": ["lead", "clerk"],
  "stock.move": ["lead", "clerk"],
  "stock.reorder.manage": ["lead"],
  "incidents.read": ["admin", "lead", "auditor"],
  "incidents.report": ["lead"],
  "incidents.work": ["lead"],
  "incidents.export": ["admin", "lead", "auditor"],
  "audit.read": ["admin", "auditor"],
  "audit.verify": ["admin", "auditor"],
  "users.manage": ["admin"],
  "sites.manage": ["admin"],
  "mail.outbox.view": ["admin"],
  "account.self": ["admin", "lead", "clerk", "technician", "auditor"],
};
