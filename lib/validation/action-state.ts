/** The one result shape of every form's server action. */
export type ActionState =
  | { status: "idle" }
  | { status: "invalid"; fieldErrors: Record<string, string[]>; message?: string }
  | { status: "error"; message: string }
  | { status: "success"; message: string };

export const IDLE: ActionState = { status: "idle" };
