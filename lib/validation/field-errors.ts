import type { z } from "zod";

/** Turns a zod error into `{field: [messages]}`, with nested paths joined by dots; form-level issues go under `body`. */
export function zodFieldErrors(error: z.ZodError): Record<string, string[]> {
  const fields: Record<string, string[]> = {};
  for (const issue of error.issues) {
    const key = issue.path.length ? issue.path.map(String).join(".") : "body";
    (fields[key] ??= []).push(issue.message);
  }
  return fields;
}
