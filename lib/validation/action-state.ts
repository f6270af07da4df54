/** The one result shape of every form's server action. */
export type ActionState =
  | { status: "idle" }
  /** `values`: what was sent, so a form that React resets after its action can show it again. */
  | { status: "invalid"; fieldErrors: Record<string, string[]>; message?: string; values?: Record<string, unknown> }
  | { status: "error"; message: string }
  | { status: "success"; message: string };

export const IDLE: ActionState = { status: "idle" };

/** The values a form should show: what was just sent when it came back invalid, else the initial values. */
export function formValues<T extends Record<string, unknown>>(state: ActionState, initial: T): Record<string, unknown> {
  return state.status === "invalid" && state.values ? state.values : initial;
}
