"use server";

import { headers } from "next/headers";
import { AppError, toAppError } from "@/lib/server/errors";
import { log } from "@/lib/server/log";
import { acceptInvitation } from "@/lib/server/queries/users";
import { crossOriginProblem } from "@/lib/server/request";
import type { ActionState } from "@/lib/validation/action-state";
import { setPasswordSchema } from "@/lib/validation/auth";
import { zodFieldErrors } from "@/lib/validation/field-errors";

/** Sets the password of an invited person. Needs no session: the one-time link is the proof. */
export async function acceptInvitationAction(input: unknown): Promise<ActionState> {
  try {
    const problem = crossOriginProblem("POST", await headers());
    if (problem) {
      log("warn", "csrf_rejected", { via: "server_action", problem });
      return { status: "error", message: "This form was sent from another site and was refused." };
    }
    const parsed = setPasswordSchema.safeParse(input);
    if (!parsed.success) return { status: "invalid", fieldErrors: zodFieldErrors(parsed.error) };
    await acceptInvitation(parsed.data.token, parsed.data.password);
    return { status: "success", message: "Your password is set. Sign in with it now." };
  } catch (error) {
    const appError = error instanceof AppError ? error : toAppError(error);
    return { status: "error", message: appError.message };
  }
}
