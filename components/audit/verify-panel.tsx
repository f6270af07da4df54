"use client";

import { useMutation } from "@tanstack/react-query";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { apiFetch } from "@/lib/api-client";

interface Verification {
  ok: boolean;
  checked: number;
  firstBrokenSeq?: number;
  problem?: "gap" | "link" | "hash";
  headSeq: number;
  headHash: string;
}

const PROBLEM = {
  gap: "is missing (deleted, or the end of the chain was cut off)",
  link: "does not point at the entry before it (an entry before it was rewritten)",
  hash: "does not match its own content (it was changed after it was written)",
} as const;

/** Runs GET /api/v1/audit/verify and says plainly whether the chain holds and, if not, where it breaks. */
export function VerifyPanel() {
  const verify = useMutation({
    mutationFn: () => apiFetch<Verification>("/api/v1/audit/verify", { cache: "no-store" }),
  });
  return (
    <div className="space-y-3">
      <Button onClick={() => verify.mutate()} disabled={verify.isPending}>
        {verify.isPending ? "Checking every entry…" : "Verify the chain"}
      </Button>
      {verify.isError ? <Notice tone="danger">The check could not run: {verify.error.message}</Notice> : null}
      {verify.data?.ok ? (
        <Notice tone="success" title="The chain is intact">
          {verify.data.checked} entries rechecked; each one matches its content and points at the one before.
          Head: entry {verify.data.headSeq}, hash{" "}
          <span className="font-mono text-2xs break-all">{verify.data.headHash}</span>.
        </Notice>
      ) : null}
      {verify.data && !verify.data.ok ? (
        <Notice tone="danger" title={`The chain is broken at entry ${verify.data.firstBrokenSeq}`}>
          Entry {verify.data.firstBrokenSeq}{" "}
          {verify.data.problem ? PROBLEM[verify.data.problem] : "does not hold"}. {verify.data.checked}{" "}
          entries were checked. Keep the database as it is and tell whoever owns the system: the record from
          this entry on cannot be trusted.
        </Notice>
      ) : null}
    </div>
  );
}
