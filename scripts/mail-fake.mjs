// The local SMTP fake: accepts every mail on loopback and shows the inbox as JSON and as a page.
// Development and tests only. Usage: node scripts/mail-fake.mjs [--smtp-port 2525] [--http-port 2526]
import http from "node:http";
import { pathToFileURL } from "node:url";
import { simpleParser } from "mailparser";
import { SMTPServer } from "smtp-server";

const escapeHtml = (s) =>
  String(s).replace(/[&<>"']/g, (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" })[c]);

/**
 * Starts the fake. Returns the ports, the in-memory messages and a close function.
 * `temporaryFailures` makes the next N mails fail with a 451 (for retry tests).
 */
export async function startMailFake({ smtpPort = 2525, httpPort = 2526, host = "127.0.0.1", quiet = false } = {}) {
  const messages = [];
  const state = { temporaryFailures: 0, nextId: 1 };

  const smtp = new SMTPServer({
    authOptional: true,
    disabledCommands: ["STARTTLS"],
    logger: false,
    size: 10 * 1024 * 1024,
    onData(stream, session, callback) {
      const chunks = [];
      stream.on("data", (c) => chunks.push(c));
      stream.on("end", async () => {
        if (state.temporaryFailures > 0) {
          state.temporaryFailures -= 1;
          const error = new Error("Temporary failure, try again later");
          error.responseCode = 451;
          return callback(error);
        }
        try {
          const raw = Buffer.concat(chunks);
          const parsed = await simpleParser(raw);
          const message = {
            id: state.nextId++,
            messageId: parsed.messageId ?? null,
            from: parsed.from?.text ?? session.envelope.mailFrom?.address ?? "",
            to: session.envelope.rcptTo.map((r) => r.address),
            subject: parsed.subject ?? "",
            text: parsed.text ?? "",
            date: (parsed.date ?? new Date()).toISOString(),
          };
          messages.push(message);
          if (!quiet) console.log(`received mail #${message.id} to ${message.to.join(", ")}: ${message.subject}`);
          callback();
        } catch (error) {
          callback(error);
        }
      });
    },
  });

  const page = () => `<!doctype html><html lang="en"><head><meta charset="utf-8"><title>Greaseledger mail inbox (development)</title>
<meta name="viewport" content="width=device-width, initial-scale=1">
<style>body{font:15px/1.45 system-ui,sans-serif;margin:2rem auto;max-width:60rem;padding:0 1rem;color:#1f2328}
article{border:1px solid #c9c3b8;border-radius:6px;padding:.75rem 1rem;margin:.75rem 0;background:#fbfaf7}
pre{white-space:pre-wrap;font:13px/1.4 ui-monospace,monospace}h1{font-size:1.3rem}.meta{color:#555;font-size:.85rem}</style></head>
<body><h1>Mail inbox of the development fake</h1><p class="meta">${messages.length} message(s). Nothing here left this machine. JSON: <a href="/messages">/messages</a></p>
${[...messages]
  .reverse()
  .map(
    (m) => `<article><div class="meta">#${m.id} · ${escapeHtml(m.date)} · from ${escapeHtml(m.from)} · to ${escapeHtml(m.to.join(", "))}</div>
<h2>${escapeHtml(m.subject)}</h2><pre>${escapeHtml(m.text)}</pre></article>`,
  )
  .join("\n")}</body></html>`;

  const web = http.createServer((req, res) => {
    const url = new URL(req.url ?? "/", `http://${host}`);
    if (url.pathname === "/messages" && req.method === "GET") {
      res.writeHead(200, { "content-type": "application/json" });
      return res.end(JSON.stringify(messages));
    }
    if (url.pathname === "/messages" && req.method === "DELETE") {
      messages.length = 0;
      res.writeHead(204);
      return res.end();
    }
    if (url.pathname === "/control/temporary-failures" && req.method === "POST") {
      state.temporaryFailures = Number(url.searchParams.get("count") ?? "1");
      res.writeHead(204);
      return res.end();
    }
    if (url.pathname === "/" && req.method === "GET") {
      res.writeHead(200, { "content-type": "text/html; charset=utf-8" });
      return res.end(page());
    }
    res.writeHead(404, { "content-type": "text/plain" });
    res.end("not found");
  });

  await new Promise((resolve, reject) => {
    smtp.once("error", reject);
    smtp.listen(smtpPort, host, resolve);
  });
  await new Promise((resolve, reject) => {
    web.once("error", reject);
    web.listen(httpPort, host, resolve);
  });

  return {
    smtpPort: smtp.server.address().port,
    httpPort: web.address().port,
    messages,
    state,
    async close() {
      await new Promise((r) => smtp.close(r));
      await new Promise((r) => web.close(() => r()));
    },
  };
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? "").href) {
  const arg = (name, fallback) => {
    const index = process.argv.indexOf(name);
    return index >= 0 ? Number(process.argv[index + 1]) : fallback;
  };
  const fake = await startMailFake({
    smtpPort: arg("--smtp-port", Number(process.env.SMTP_PORT ?? 2525)),
    httpPort: arg("--http-port", Number(process.env.MAIL_FAKE_HTTP_PORT ?? 2526)),
  });
  console.log(`mail fake: SMTP on 127.0.0.1:${fake.smtpPort}, inbox on http://127.0.0.1:${fake.httpPort}`);
  const shutdown = () => fake.close().then(() => process.exit(0));
  process.on("SIGINT", shutdown);
  process.on("SIGTERM", shutdown);
}
