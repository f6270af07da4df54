import type { Metadata } from "next";
import { Forbidden } from "@/components/shell/forbidden";
import { Card, PageHeader } from "@/components/ui/card";
import { EmptyState } from "@/components/ui/empty-state";
import { getEnv } from "@/lib/env";
import { pageUserCan } from "@/lib/server/auth";
import { listOutbox } from "@/lib/server/mail/outbox";

export const metadata: Metadata = { title: "Mail outbox" };

const STATUS: Record<string, string> = { pending: "⏳ Waiting", sending: "↗ Sending", sent: "✔ Sent", dead: "✖ Gave up" };

export default async function OutboxPage() {
  const { allowed } = await pageUserCan("mail.outbox.view");
  if (!allowed) return <Forbidden what="The mail outbox" />;
  const rows = await listOutbox();
  const inbox = getEnv().MAIL_INBOX_URL;
  return (
    <>
      <PageHeader
        title="Mail outbox"
        lead="Every mail is written here first, in the same transaction as the change it reports, and a relay delivers it with retries. Nothing is lost while the mail server is away."
      />
      {inbox ? (
        <p className="mb-4 text-sm text-ink-soft">
          Development mail inbox: <a href={inbox}>{inbox}</a>
        </p>
      ) : null}
      <Card>
        {rows.length === 0 ? (
          <EmptyState title="No mail has been written yet">
            <p>Invitations, reorder alerts and expiry reminders appear here as they are queued and sent.</p>
          </EmptyState>
        ) : (
          <div className="overflow-x-auto">
            <table className="w-full text-sm">
              <caption className="sr-only">Outgoing mail, newest first</caption>
              <thead>
                <tr className="border-b-2 border-line-strong text-left">
                  <th className="px-2 py-2">#</th>
                  <th className="px-2 py-2">To</th>
                  <th className="px-2 py-2">Subject</th>
                  <th className="px-2 py-2">State</th>
                  <th className="px-2 py-2">Attempts</th>
                  <th className="px-2 py-2">Queued (UTC)</th>
                  <th className="px-2 py-2">Last problem</th>
                </tr>
              </thead>
              <tbody>
                {rows.map((r) => (
                  <tr key={r.id} className="border-b border-line align-top">
                    <td className="px-2 py-2">{r.id}</td>
                    <td className="px-2 py-2">{r.to}</td>
                    <td className="px-2 py-2">{r.subject}</td>
                    <td className="px-2 py-2 font-bold">{STATUS[r.status] ?? r.status}</td>
                    <td className="px-2 py-2">{r.attempts}</td>
                    <td className="px-2 py-2 whitespace-nowrap">{r.createdAt.replace("T", " ").slice(0, 19)}</td>
                    <td className="px-2 py-2 text-2xs text-ink-soft">{r.lastError ?? "—"}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        )}
      </Card>
    </>
  );
}
