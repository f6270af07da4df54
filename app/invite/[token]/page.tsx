import type { Metadata } from "next";
import Link from "next/link";
import { SetPasswordForm } from "@/components/auth/set-password-form";
import { Logo } from "@/components/shell/logo";
import { Notice } from "@/components/ui/notice";
import { getInvitation } from "@/lib/server/queries/users";
import { acceptInvitationAction } from "./actions";

export const metadata: Metadata = { title: "Set your password" };

const PROBLEMS = {
  expired: "This invitation link has expired. Ask an administrator to invite you again.",
  used: "This invitation link has already been used. Sign in with the password you set.",
  unknown: "This invitation link is not known. Check that you copied the whole link from the mail.",
} as const;

export default async function InvitePage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const invitation = token.length <= 200 ? await getInvitation(token) : ({ state: "unknown" } as const);
  return (
    <main className="mx-auto max-w-md px-6 py-12">
      <div className="mb-6 flex items-center gap-2 text-steel">
        <Logo size={32} />
        <span className="text-xl font-bold">Greaseledger</span>
      </div>
      <h1 className="mb-2 text-2xl font-bold">Set your password</h1>
      {invitation.state === "valid" ? (
        <>
          <p className="mb-6 text-sm text-ink-soft">
            Welcome, {invitation.name}. You will sign in as <strong>{invitation.email}</strong>.
          </p>
          <SetPasswordForm token={token} accept={acceptInvitationAction} />
        </>
      ) : (
        <Notice tone="caution" title="This link cannot be used">
          <p>{PROBLEMS[invitation.state]}</p>
          <p className="mt-2">
            <Link href="/sign-in">Go to sign-in</Link>
          </p>
        </Notice>
      )}
    </main>
  );
}
