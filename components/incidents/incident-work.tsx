"use client";

import { useActionState, useState } from "react";
import { TextField } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { SubmitButton } from "@/components/ui/submit-button";
import { formValues, type ActionState } from "@/lib/validation/action-state";

type FormAction = (prev: ActionState, form: FormData) => Promise<ActionState>;

export interface IncidentWorkProps {
  id: number;
  version: number;
  state: "open" | "investigating" | "closed";
  move: FormAction;
  note: FormAction;
}

/** The lead's part of an incident: take it up, close it with root cause and corrective action, reopen it, add notes. */
export function IncidentWork({ id, version, state, move, note }: IncidentWorkProps) {
  const [moveState, moveAction] = useActionState(move, { status: "idle" });
  const [noteState, noteAction] = useActionState(note, { status: "idle" });
  // A fresh, empty note field after each note that was added.
  const [noteKey, setNoteKey] = useState(0);
  const [seenNote, setSeenNote] = useState<ActionState>(noteState);
  if (seenNote !== noteState) {
    setSeenNote(noteState);
    if (noteState.status === "success") setNoteKey(noteKey + 1);
  }
  const errors = moveState.status === "invalid" ? moveState.fieldErrors : {};
  const sent = formValues(moveState, {});
  const dv = (k: string) => (sent[k] === undefined ? undefined : String(sent[k]));
  return (
    <div className="space-y-6">
      {moveState.status === "success" ? <Notice tone="success">{moveState.message}</Notice> : null}
      {moveState.status === "error" ? <Notice tone="danger">{moveState.message}</Notice> : null}
      {state === "open" ? (
        <form action={moveAction} aria-label="Start the investigation" className="space-y-2">
          <input type="hidden" name="id" value={id} />
          <input type="hidden" name="version" value={version} />
          <input type="hidden" name="to" value="investigating" />
          <TextField id="inv-note" name="note" label="What you will check (optional)" />
          <SubmitButton pendingLabel="Saving…">Start the investigation</SubmitButton>
        </form>
      ) : null}
      {state !== "closed" ? (
        <form
          action={moveAction}
          aria-label="Close the incident"
          className="space-y-3"
          key={moveState.status === "invalid" ? JSON.stringify(sent) : `close-${version}`}
        >
          <input type="hidden" name="id" value={id} />
          <input type="hidden" name="version" value={version} />
          <input type="hidden" name="to" value="closed" />
          <TextField
            id="rootCause"
            name="rootCause"
            label="Root cause"
            rows={3}
            errors={errors.rootCause}
            defaultValue={dv("rootCause")}
          />
          <TextField
            id="correctiveAction"
            name="correctiveAction"
            label="Corrective action"
            rows={3}
            errors={errors.correctiveAction}
            defaultValue={dv("correctiveAction")}
            hint="What was done to the bearing (purge, clean-out, replacement) and what stops it happening again."
          />
          <SubmitButton pendingLabel="Closing…">Close the incident</SubmitButton>
        </form>
      ) : (
        <form action={moveAction} aria-label="Reopen the incident" className="space-y-2">
          <input type="hidden" name="id" value={id} />
          <input type="hidden" name="version" value={version} />
          <input type="hidden" name="to" value="open" />
          <TextField id="reopen-note" name="note" label="Why it is reopened" />
          <SubmitButton variant="secondary" pendingLabel="Reopening…">
            Reopen
          </SubmitButton>
        </form>
      )}
      <form action={noteAction} aria-label="Add a note" className="space-y-2" key={noteKey}>
        <input type="hidden" name="id" value={id} />
        {noteState.status === "error" ? <Notice tone="danger">{noteState.message}</Notice> : null}
        {noteState.status === "success" ? <Notice tone="success">{noteState.message}</Notice> : null}
        <TextField
          id="note"
          name="note"
          label="Note for the timeline"
          rows={2}
          errors={noteState.status === "invalid" ? noteState.fieldErrors.note : undefined}
        />
        <SubmitButton variant="secondary" pendingLabel="Adding…">
          Add the note
        </SubmitButton>
      </form>
    </div>
  );
}
