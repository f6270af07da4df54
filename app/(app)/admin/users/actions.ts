"use server";

import { runAction, formToObject } from "@/lib/server/action";
import { changeRole, inviteUser, setSiteAccess, setUserDisabled } from "@/lib/server/queries/users";
import type { ActionState } from "@/lib/validation/action-state";
import { changeRoleSchema, inviteUserSchema, siteAccessSchema, userIdSchema } from "@/lib/validation/auth";

const PATHS = ["/admin/users", "/overview"];

export async function inviteUserAction(input: unknown): Promise<ActionState> {
  return runAction(
    { action: "users.manage", schema: inviteUserSchema, revalidate: PATHS, success: "Invitation sent." },
    input,
    async (data, user) => {
      await inviteUser(data, user);
    },
  );
}

export async function changeRoleAction(_prev: ActionState, form: FormData): Promise<ActionState> {
  return runAction(
    { action: "users.manage", schema: changeRoleSchema, revalidate: PATHS, success: "Role changed; their sessions have ended." },
    formToObject(form),
    (data, user) => changeRole(data.userId, data.role, user),
  );
}

export async function setSiteAccessAction(_prev: ActionState, form: FormData): Promise<ActionState> {
  return runAction(
    { action: "users.manage", schema: siteAccessSchema, revalidate: PATHS, success: "Site access saved." },
    formToObject(form, ["siteIds"]),
    (data, user) => setSiteAccess(data.userId, data.siteIds, user),
  );
}

export async function disableUserAction(_prev: ActionState, form: FormData): Promise<ActionState> {
  return runAction(
    { action: "users.manage", schema: userIdSchema, revalidate: PATHS, success: "User disabled; their sessions have ended." },
    formToObject(form),
    (data, user) => setUserDisabled(data.userId, true, user),
  );
}

export async function enableUserAction(_prev: ActionState, form: FormData): Promise<ActionState> {
  return runAction(
    { action: "users.manage", schema: userIdSchema, revalidate: PATHS, success: "User enabled." },
    formToObject(form),
    (data, user) => setUserDisabled(data.userId, false, user),
  );
}
