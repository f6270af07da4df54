"use server";

import { redirect } from "next/navigation";
import { formToObject, runAction } from "@/lib/server/action";
import { addIncidentNote, moveIncident, reportFoundMix } from "@/lib/server/queries/incidents";
import type { ActionState } from "@/lib/validation/action-state";
import { incidentMoveSchema, incidentNoteSchema, incidentReportSchema } from "@/lib/validation/incidents";

const SAID = {
  investigating: "Investigation started.",
  closed: "Incident closed.",
  open: "Incident reopened.",
} as const;

export async function reportIncidentAction(_prev: ActionState, form: FormData): Promise<ActionState> {
  let id: number | null = null;
  const state = await runAction(
    {
      action: "incidents.report",
      schema: incidentReportSchema,
      revalidate: ["/incidents"],
      success: "Reported.",
    },
    formToObject(form),
    async (data, user) => {
      id = (await reportFoundMix(data, user.id)).id;
    },
  );
  if (state.status === "success" && id) redirect(`/incidents/${id}`);
  return state;
}

export async function moveIncidentAction(_prev: ActionState, form: FormData): Promise<ActionState> {
  const values = formToObject(form);
  const to = values.to as keyof typeof SAID;
  return runAction(
    {
      action: "incidents.work",
      schema: incidentMoveSchema,
      revalidate: ["/incidents", `/incidents/${String(values.id)}`],
      success: SAID[to] ?? "Saved.",
    },
    values,
    (data, user) => moveIncident(data, user.id),
  );
}

export async function incidentNoteAction(_prev: ActionState, form: FormData): Promise<ActionState> {
  const values = formToObject(form);
  return runAction(
    {
      action: "incidents.work",
      schema: incidentNoteSchema,
      revalidate: [`/incidents/${String(values.id)}`],
      success: "Note added.",
    },
    values,
    (data, user) => addIncidentNote(data, user.id),
  );
}
