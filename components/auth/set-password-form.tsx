"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import Link from "next/link";
import { useState, useTransition } from "react";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { Field, describedBy, inputClasses } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { SubmitButton } from "@/components/ui/submit-button";
import { PASSWORD_MIN_LENGTH } from "@/lib/domain/auth";
import type { ActionState } from "@/lib/validation/action-state";
import { setPasswordSchema } from "@/lib/validation/auth";

type Values = z.input<typeof setPasswordSchema>;

export function SetPasswordForm({ token, accept }: { token: string; accept: (input: unknown) => Promise<ActionState> }) {
  const [result, setResult] = useState<ActionState>({ status: "idle" });
  const [pending, startTransition] = useTransition();
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm<Values>({ resolver: zodResolver(setPasswordSchema), defaultValues: { token, password: "", confirm: "" } });

  const onSubmit = handleSubmit((values) =>
    startTransition(async () => {
      const state = await accept(values);
      setResult(state);
      if (state.status === "invalid") {
        for (const [name, messages] of Object.entries(state.fieldErrors)) setError(name as keyof Values, { message: messages[0] });
      }
    }),
  );

  if (result.status === "success") {
    return (
      <Notice tone="success" title="Password set">
        <p>{result.message}</p>
        <p className="mt-2">
          <Link href="/sign-in">Go to sign-in</Link>
        </p>
      </Notice>
    );
  }

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4" aria-label="Set your password">
      {result.status === "error" ? <Notice tone="danger">{result.message}</Notice> : null}
      <input type="hidden" {...register("token")} />
      <Field
        id="new-password"
        label="New password"
        hint={`At least ${PASSWORD_MIN_LENGTH} characters. A few unrelated words make a good one.`}
        errors={errors.password?.message}
      >
        <input
          id="new-password"
          type="password"
          autoComplete="new-password"
          className={inputClasses}
          aria-invalid={Boolean(errors.password)}
          aria-describedby={describedBy("new-password", true)}
          {...register("password")}
        />
      </Field>
      <Field id="confirm-password" label="The same password again" errors={errors.confirm?.message}>
        <input
          id="confirm-password"
          type="password"
          autoComplete="new-password"
          className={inputClasses}
          aria-invalid={Boolean(errors.confirm)}
          aria-describedby={describedBy("confirm-password")}
          {...register("confirm")}
        />
      </Field>
      <SubmitButton size="lg" pending={pending} pendingLabel="Saving…">
        Set password
      </SubmitButton>
    </form>
  );
}
