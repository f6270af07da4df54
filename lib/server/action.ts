import "server-only";
import { revalidatePath } from "next/cache";
import type { z } from "zod";
import type { Action } from "@/lib/domain/permissions";
import type { ActionState } from "@/lib/validation/action-state";
import { zodFieldErrors } from "@/lib/validation/field-errors";
import { getCurrentSession, requireActionUser } from "./auth";
import { AppError, ValidationError, toAppError } from "./errors";
import { withRequestContext } from "./request-context";
import type { SessionUser } from "./session";

/**
 * The five steps of every server action: session and role → parse with the shared schema → do the
 * work → revalidate → answer with an ActionState. Errors never escape as exceptions.
 */
export async function runAction<S extends z.ZodType>(
  options: { action: Action; schema: S; revalidate?: string[]; success: string },
  input: unknown,
  work: (data: z.output<S>, user: SessionUser) => Promise<void>,
): Promise<ActionState> {
  try {
    const user = await requireActionUser(options.action);
    const parsed = options.schema.safeParse(input);
    if (!parsed.success) throw new ValidationError(zodFieldErrors(parsed.error));
    const session = await getCurrentSession();
    const siteIds = session?.user.id === user.id ? session.siteIds : undefined;
    if (siteIds) await withRequestContext({ userId: user.id, siteIds }, () => work(parsed.data, user));
    else await work(parsed.data, user);
    for (const path of options.revalidate ?? []) revalidatePath(path);
    return { status: "success", message: options.success };
  } catch (error) {
    const appError = error instanceof AppError ? error : toAppError(error);
    if (appError.fields) {
      const values = input && typeof input === "object" && !Array.isArray(input) ? (input as Record<string, unknown>) : undefined;
      return { status: "invalid", fieldErrors: appError.fields, message: appError.message, values };
    }
    return { status: "error", message: appError.message };
  }
}

/** Reads a FormData into a plain object; repeated names become arrays. */
export function formToObject(form: FormData, arrays: string[] = []): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  for (const name of arrays) out[name] = form.getAll(name).map(String);
  for (const [key, value] of form.entries()) {
    if (arrays.includes(key) || key.startsWith("$ACTION")) continue;
    out[key] = typeof value === "string" ? value : value.name;
  }
  return out;
}
