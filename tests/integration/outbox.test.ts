import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createScratchDatabase, freePort } from "./helpers";

// This file's database is its own, so the app's relay does not deliver these mails first.
const DB = "gl_outbox_test";
process.env.DATABASE_NAME = DB;

type Outbox = typeof import("@/lib/server/mail/outbox");
type Transport = typeof import("@/lib/server/mail/transport");
let outbox: Outbox;
let transport: Transport;
let sequelize: import("sequelize").Sequelize;

// @ts-expect-error plain ES module without types
import { startMailFake } from "../../scripts/mail-fake.mjs";

beforeAll(async () => {
  await createScratchDatabase(DB);
  outbox = await import("@/lib/server/mail/outbox");
  transport = await import("@/lib/server/mail/transport");
  sequelize = (await import("@/lib/server/db")).getSequelize();
});

afterAll(async () => {
  await sequelize?.close();
});

async function row(id: number) {
  const [r] = (await sequelize.query("SELECT status, attempts, last_error FROM mail_outbox WHERE id = ?", {
    replacements: [id],
    type: "SELECT",
  })) as { status: string; attempts: number; last_error: string | null }[];
  return r!;
}

describe("the mail outbox and its relay", () => {
  it("keeps a mail pending while SMTP is down, then delivers exactly one when it is back", async () => {
    const smtpPort = await freePort();
    const smtp = transport.smtpTransport({ host: "127.0.0.1", port: smtpPort });
    const id = (await outbox.enqueueMail({ to: ["lead@example.com"], subject: "Low stock: test grease", text: "Order 12 cartridges." }))!;

    const down = await outbox.relayOutboxOnce(smtp);
    expect(down).toEqual({ sent: 0, failed: 1 });
    expect(await row(id)).toMatchObject({ status: "pending", attempts: 1 });
    expect((await row(id)).last_error).toMatch(/ECONNREFUSED|connect/i);

    // Not due yet: the backoff holds the next attempt back.
    expect(await outbox.relayOutboxOnce(smtp)).toEqual({ sent: 0, failed: 0 });

    const fake = await startMailFake({ smtpPort, httpPort: 0, quiet: true });
    try {
      const later = new Date(Date.now() + 3_600_000);
      expect(await outbox.relayOutboxOnce(smtp, { now: later })).toEqual({ sent: 1, failed: 0 });
      expect(await outbox.relayOutboxOnce(smtp, { now: later })).toEqual({ sent: 0, failed: 0 });
      expect(fake.messages).toHaveLength(1);
      expect(fake.messages[0]).toMatchObject({ subject: "Low stock: test grease", to: ["lead@example.com"] });
      expect(fake.messages[0].messageId).toBe(outbox.outboxMessageId(id));
      expect(await row(id)).toMatchObject({ status: "sent", attempts: 2 });
    } finally {
      await fake.close();
    }
  });

  it("retries after a temporary SMTP refusal and then sends once", async () => {
    const fake = await startMailFake({ smtpPort: 0, httpPort: 0, quiet: true });
    try {
      fake.state.temporaryFailures = 2;
      const smtp = transport.smtpTransport({ host: "127.0.0.1", port: fake.smtpPort });
      const id = (await outbox.enqueueMail({ to: ["clerk@example.com"], subject: "Retry me", text: "…" }))!;
      let now = new Date();
      for (let i = 0; i < 3; i++) {
        await outbox.relayOutboxOnce(smtp, { now });
        now = new Date(now.getTime() + 3_600_000);
      }
      expect(fake.messages.filter((m: { subject: string }) => m.subject === "Retry me")).toHaveLength(1);
      expect(await row(id)).toMatchObject({ status: "sent", attempts: 3 });
    } finally {
      await fake.close();
    }
  });

  it("two relays running at once deliver each mail once", async () => {
    const fake = await startMailFake({ smtpPort: 0, httpPort: 0, quiet: true });
    try {
      const smtp = transport.smtpTransport({ host: "127.0.0.1", port: fake.smtpPort });
      for (let i = 0; i < 10; i++) await outbox.enqueueMail({ to: ["lead@example.com"], subject: `Parallel ${i}`, text: "x" });
      const later = new Date(Date.now() + 7_200_000);
      await Promise.all([
        outbox.relayOutboxOnce(smtp, { now: later, batchSize: 4 }),
        outbox.relayOutboxOnce(smtp, { now: later, batchSize: 4 }),
        outbox.relayOutboxOnce(smtp, { now: later, batchSize: 4 }),
      ]);
      await outbox.relayOutboxOnce(smtp, { now: later });
      const subjects = fake.messages.map((m: { subject: string }) => m.subject).filter((s: string) => s.startsWith("Parallel"));
      expect(subjects.sort()).toEqual(Array.from({ length: 10 }, (_, i) => `Parallel ${i}`).sort());
    } finally {
      await fake.close();
    }
  });

  it("a dedupe key puts a mail in the outbox only once", async () => {
    const first = await outbox.enqueueMail({ to: ["a@example.com"], subject: "Once", text: "x", dedupeKey: "episode-1" });
    const second = await outbox.enqueueMail({ to: ["a@example.com"], subject: "Once", text: "x", dedupeKey: "episode-1" });
    expect(first).toBeGreaterThan(0);
    expect(second).toBeNull();
  });

  it("a rolled-back transaction leaves no mail behind", async () => {
    await expect(
      sequelize.transaction(async (t) => {
        await outbox.enqueueMail({ to: ["a@example.com"], subject: "Rolled back", text: "x" }, t);
        throw new Error("the change failed");
      }),
    ).rejects.toThrow("the change failed");
    const rows = await sequelize.query("SELECT id FROM mail_outbox WHERE subject = 'Rolled back'", { type: "SELECT" });
    expect(rows).toHaveLength(0);
  });
});
