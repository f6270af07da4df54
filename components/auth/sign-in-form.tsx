"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { Field, describedBy, inputClasses } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { SubmitButton } from "@/components/ui/submit-button";
import { signInSchema, type SignInInput } from "@/lib/validation/auth";

/** Sign-in through the public API (`POST /api/v1/session`), then a full page load of the overview. */
export function SignInForm({ next = "/overview" }: { next?: string }) {
  const [problem, setProblem] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<SignInInput>({ resolver: zodResolver(signInSchema) });

  const onSubmit = handleSubmit(async (values) => {
    setProblem(null);
    let response: Response;
    try {
      response = await fetch("/api/v1/session", {
        method: "POST",
        headers: { "content-type": "application/json" },
        body: JSON.stringify(values),
      });
    } catch {
      setProblem("The server could not be reached. Check the connection and try again.");
      return;
    }
    if (response.ok) {
      // A full load, so the server renders the signed-in layout with the new cookie.
      window.location.replace(new URL(next, window.location.origin).href);
      return;
    }
    const body = (await response.json().catch(() => null)) as {
      error?: { message?: string; fields?: Record<string, string[]> };
    } | null;
    for (const [name, messages] of Object.entries(body?.error?.fields ?? {})) {
      if (name === "email" || name === "password") setError(name, { message: messages[0] });
    }
    setProblem(body?.error?.message ?? "Signing in did not work. Try again.");
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4" aria-label="Sign in">
      {problem ? <Notice tone="danger" title="Not signed in">{problem}</Notice> : null}
      <Field id="email" label="E-mail address" errors={errors.email?.message}>
        <input
          id="email"
          type="email"
          autoComplete="username"
          inputMode="email"
          className={inputClasses}
          aria-invalid={Boolean(errors.email)}
          aria-describedby={describedBy("email")}
          {...register("email")}
        />
      </Field>
      <Field id="password" label="Password" errors={errors.password?.message}>
        <input
          id="password"
          type="password"
          autoComplete="current-password"
          className={inputClasses}
          aria-invalid={Boolean(errors.password)}
          aria-describedby={describedBy("password")}
          {...register("password")}
        />
      </Field>
      <SubmitButton size="lg" pending={isSubmitting} pendingLabel="Signing in…">
        Sign in
      </SubmitButton>
    </form>
  );
}
