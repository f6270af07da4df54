export { ROLES, ROLE_LABELS, ACTIONS } from "./types";
export type { Role, Action } from "./types";
export { can, isRole, isAction } from "./can";
