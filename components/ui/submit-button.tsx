"use client";

import { useFormStatus } from "react-dom";
import { Button, type ButtonProps } from "./button";

export interface SubmitButtonProps extends ButtonProps {
  pendingLabel?: string;
  /** For forms not driven by a form action (e.g. react-hook-form with fetch). */
  pending?: boolean;
}

/** The one submit button: disabled and relabelled while its form is being sent. */
export function SubmitButton({ children, pendingLabel = "Working…", pending, ...props }: SubmitButtonProps) {
  const status = useFormStatus();
  const busy = pending ?? status.pending;
  return (
    <Button type="submit" disabled={busy || props.disabled} aria-busy={busy} {...props}>
      {busy ? pendingLabel : children}
    </Button>
  );
}
