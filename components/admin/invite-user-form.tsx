"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useState, useTransition } from "react";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { Field, describedBy, inputClasses } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { SubmitButton } from "@/components/ui/submit-button";
import { ROLES, ROLE_LABELS } from "@/lib/domain/permissions";
import type { ActionState } from "@/lib/validation/action-state";
import { inviteUserSchema } from "@/lib/validation/auth";

type Input = z.input<typeof inviteUserSchema>;
type Output = z.output<typeof inviteUserSchema>;

export interface InviteUserFormProps {
  sites: { id: number; name: string }[];
  invite: (input: unknown) => Promise<ActionState>;
}

export function InviteUserForm({ sites, invite }: InviteUserFormProps) {
  const [result, setResult] = useState<ActionState>({ status: "idle" });
  const [pending, startTransition] = useTransition();
  const {
    register,
    handleSubmit,
    reset,
    setError,
    formState: { errors },
  } = useForm<Input, unknown, Output>({
    resolver: zodResolver(inviteUserSchema),
    defaultValues: { email: "", name: "", role: "technician", siteIds: [] },
  });

  const onSubmit = handleSubmit((values) =>
    startTransition(async () => {
      const state = await invite(values);
      setResult(state);
      if (state.status === "invalid") {
        for (const [name, messages] of Object.entries(state.fieldErrors)) {
          setError(name as keyof Input, { message: messages[0] });
        }
      }
      if (state.status === "success") reset();
    }),
  );

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-3" aria-label="Invite a person">
      {result.status === "success" ? <Notice tone="success">{result.message} The link is valid for 72 hours.</Notice> : null}
      {result.status === "error" ? <Notice tone="danger">{result.message}</Notice> : null}
      <Field id="invite-name" label="Name" errors={errors.name?.message}>
        <input id="invite-name" className={inputClasses} aria-invalid={Boolean(errors.name)} aria-describedby={describedBy("invite-name")} {...register("name")} />
      </Field>
      <Field id="invite-email" label="E-mail address" errors={errors.email?.message}>
        <input
          id="invite-email"
          type="email"
          className={inputClasses}
          aria-invalid={Boolean(errors.email)}
          aria-describedby={describedBy("invite-email")}
          {...register("email")}
        />
      </Field>
      <Field id="invite-role" label="Role" errors={errors.role?.message}>
        <select id="invite-role" className={inputClasses} aria-describedby={describedBy("invite-role")} {...register("role")}>
          {ROLES.map((role) => (
            <option key={role} value={role}>
              {ROLE_LABELS[role]}
            </option>
          ))}
        </select>
      </Field>
      <fieldset className="flex flex-col gap-1">
        <legend className="text-sm font-bold">Sites</legend>
        {sites.length === 0 ? <p className="text-sm text-ink-soft">No sites exist yet.</p> : null}
        {sites.map((site) => (
          <label key={site.id} className="flex min-h-10 items-center gap-2 text-sm">
            <input type="checkbox" value={site.id} className="h-5 w-5" {...register("siteIds")} />
            {site.name}
          </label>
        ))}
        {errors.siteIds ? <p className="text-sm text-bad">{errors.siteIds.message}</p> : null}
      </fieldset>
      <SubmitButton pending={pending} pendingLabel="Sending…">
        Send invitation
      </SubmitButton>
    </form>
  );
}
