"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { Field, inputClasses } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { SubmitButton } from "@/components/ui/submit-button";

/** Uploads a safety or technical data sheet (PDF) through `POST /api/v1/greases/{id}/documents`. */
export function DocumentUpload({ greaseId, kind, label }: { greaseId: number; kind: "sds" | "tds"; label: string }) {
  const router = useRouter();
  const [pending, setPending] = useState(false);
  const [message, setMessage] = useState<{ tone: "success" | "danger"; text: string } | null>(null);
  const id = `upload-${kind}`;

  async function onSubmit(event: React.FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    form.set("kind", kind);
    setPending(true);
    setMessage(null);
    try {
      const response = await fetch(`/api/v1/greases/${greaseId}/documents`, { method: "POST", body: form });
      const body = (await response.json().catch(() => null)) as { error?: { message: string } } | null;
      if (!response.ok) setMessage({ tone: "danger", text: body?.error?.message ?? "The upload failed." });
      else {
        setMessage({ tone: "success", text: `${label} uploaded.` });
        router.refresh();
      }
    } catch {
      setMessage({ tone: "danger", text: "The server could not be reached." });
    } finally {
      setPending(false);
    }
  }

  return (
    <form onSubmit={onSubmit} className="flex flex-wrap items-end gap-2" aria-label={`Upload ${label}`}>
      <Field id={id} label={`Upload ${label} (PDF, at most 10 MB)`} className="min-w-64 flex-1">
        <input id={id} name="file" type="file" accept="application/pdf,.pdf" required className={inputClasses} />
      </Field>
      <SubmitButton variant="secondary" pending={pending} pendingLabel="Uploading…">
        Upload
      </SubmitButton>
      {message ? (
        <Notice tone={message.tone} className="w-full">
          {message.text}
        </Notice>
      ) : null}
    </form>
  );
}
