import { describe, expect, it } from "vitest";
import { ACTIONS, ROLES, can, type Action, type Role } from "@/lib/domain/permissions";

/*
 * The expected matrix, written out by hand from the product brief's roles (common practice, no source):
 * the auditor only reads, the clerk keeps stock, the technician services points and draws stock,
 * the lead owns catalogue, rules, points and incidents, the admin manages people and reads for audit.
 * A = admin, L = lead, C = clerk, T = technician, U = auditor.
 */
const EXPECTED: Record<Action, string> = {
  "overview.view": "ALCTU",
  "catalogue.read": "ALCTU",
  "catalogue.write": "AL",
  "compatibility.evaluate": "ALCTU",
  "compatibility.rules.manage": "AL",
  "calculations.use": "ALCTU",
  "points.read": "ALCTU",
  "points.write": "AL",
  "service.record": "LT",
  "services.export": "ALU",
  "stock.read": "ALCTU",
  "stock.receive": "LC",
  "stock.issue": "LCT",
  "stock.count": "LC",
  "stock.move": "LC",
  "stock.reorder.manage": "L",
  "incidents.read": "ALU",
  "incidents.report": "L",
  "incidents.work": "L",
  "incidents.export": "ALU",
  "audit.read": "AU",
  "audit.verify": "AU",
  "users.manage": "A",
  "sites.manage": "A",
  "mail.outbox.view": "A",
  "account.self": "ALCTU",
};
const LETTER: Record<Role, string> = { admin: "A", lead: "L", clerk: "C", technician: "T", auditor: "U" };

const cells = ROLES.flatMap((role) => ACTIONS.map((action) => [role, action, EXPECTED[action].includes(LETTER[role])] as const));

describe("can(role, action)", () => {
  it("has an expectation for every action", () => {
    expect(Object.keys(EXPECTED).sort()).toEqual([...ACTIONS].sort());
  });

  it.each(cells)("%s → %s is %s", (role, action, allowed) => {
    expect(can(role, action)).toBe(allowed);
  });

  it.each([
    ["an unknown role", "superuser", "catalogue.read"],
    ["an unknown action", "admin", "catalogue.delete_everything"],
    ["a prototype key as action", "admin", "constructor"],
    ["a prototype key as role", "__proto__", "catalogue.read"],
    ["an empty role", "", "overview.view"],
    ["undefined", undefined, "overview.view"],
    ["null", null, null],
    ["a number", 1, "overview.view"],
    ["a role in another case", "Admin", "users.manage"],
  ])("fails closed for %s", (_label, role, action) => {
    expect(can(role, action)).toBe(false);
  });

  it("never lets the auditor write", () => {
    const writes = ACTIONS.filter((a) => !/\.(read|view|evaluate|use|verify|export|self)$/.test(a));
    expect(writes.length).toBeGreaterThan(5);
    for (const action of writes) expect(can("auditor", action)).toBe(false);
  });
});
