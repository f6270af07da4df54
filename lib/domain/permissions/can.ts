import { PERMISSION_TABLE } from "./table";
import { ACTIONS, ROLES, type Action, type Role } from "./types";

/**
 * Decides whether a role may perform an action. Fails closed: an unknown role, an unknown action,
 * or a value that is not a string at all gives `false`.
 */
export function can(role: unknown, action: unknown): boolean {
  if (typeof role !== "string" || typeof action !== "string") return false;
  if (!isRole(role) || !isAction(action)) return false;
  const allowed = Object.prototype.hasOwnProperty.call(PERMISSION_TABLE, action)
    ? PERMISSION_TABLE[action]
    : undefined;
  return Array.isArray(allowed) && allowed.includes(role);
}

export function isRole(value: unknown): value is Role {
  return typeof value === "string" && (ROLES as readonly string[]).includes(value);
}

export function isAction(value: unknown): value is Action {
  return typeof value === "string" && (ACTIONS as readonly string[]).includes(value);
}
