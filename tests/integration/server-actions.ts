import { readFileSync } from "node:fs";
import { createRequire } from "node:module";
import path from "node:path";
import { APP_URL, ROOT, type Client } from "./helpers";

/*
 * Calling server actions over HTTP, the way the browser does: the action's id from the build's manifest in the
 * `Next-Action` header, its arguments encoded with React's own reply encoder (the same one the client bundle
 * uses), the session cookie and the Origin of the page. The answer is React's flight stream; the action's return
 * value is the row that the first row points to.
 */

const require = createRequire(import.meta.url);
const { encodeReply } = require("next/dist/compiled/react-server-dom-webpack/client.node") as {
  encodeReply: (value: unknown[]) => Promise<string | FormData>;
};

export interface ManifestAction {
  id: string;
  /** "<file>#<exported name>", the key of SERVER_ACTION_POLICY. */
  key: string;
  /** A page that imports the action (the request is sent there, as a form on that page would). */
  page: string;
}

/** The server actions of the build `npm test` serves (`.next/server/server-reference-manifest.json`). */
export function manifestActions(): ManifestAction[] {
  const file = path.join(ROOT, ".next", "server", "server-reference-manifest.json");
  const manifest = JSON.parse(readFileSync(file, "utf8")) as {
    node: Record<string, { filename?: string; exportedName?: string; workers: Record<string, unknown> }>;
  };
  return Object.entries(manifest.node).map(([id, entry]) => {
    if (!entry.filename || !entry.exportedName) throw new Error(`the manifest entry ${id} names no file or export`);
    const worker = Object.keys(entry.workers).sort((a, b) => a.split("[").length - b.split("[").length)[0] ?? "app/page";
    const page =
      "/" +
      worker
        .replace(/^app\//, "")
        .replace(/\/?page$/, "")
        .split("/")
        .filter((s) => s && !/^\(.*\)$/.test(s))
        .map((s) => (/^\[.*\]$/.test(s) ? "0" : s))
        .join("/");
    return { id, key: `${entry.filename}#${entry.exportedName}`, page };
  });
}

export interface ActionAnswer {
  status: number;
  /** The action's return value (undefined when it redirected or threw). */
  result: unknown;
  redirect: string | null;
  text: string;
}

/** Posts one server action call with the client's cookies; `headers` are added to the browser's own (null drops one). */
export async function callAction(
  client: Client | null,
  action: ManifestAction,
  args: unknown[],
  headers: Record<string, string | null> = {},
): Promise<ActionAnswer> {
  const body = await encodeReply(args);
  const sent: Record<string, string> = { accept: "text/x-component", "next-action": action.id, origin: new URL(APP_URL).origin };
  for (const [name, value] of Object.entries(headers)) {
    if (value === null) delete sent[name];
    else sent[name] = value;
  }
  if (typeof body === "string") sent["content-type"] = "text/plain;charset=UTF-8";
  if (client?.cookies.size) sent.cookie = [...client.cookies].map(([k, v]) => `${k}=${v}`).join("; ");
  const response = await fetch(new URL(action.page, APP_URL), { method: "POST", headers: sent, body, redirect: "manual" });
  const text = await response.text();
  return {
    status: response.status,
    result: actionResult(text),
    redirect: response.headers.get("x-action-redirect"),
    text,
  };
}

/** The return value in a flight answer: row 0 is `{a: "$@<row>", …}`; that row holds the value as JSON. */
export function actionResult(flight: string): unknown {
  const rows = new Map<string, string>();
  for (const line of flight.split("\n")) {
    const match = /^([0-9a-f]+):(.*)$/.exec(line);
    if (match) rows.set(match[1]!, match[2]!);
  }
  let root: { a?: unknown };
  try {
    root = JSON.parse(rows.get("0") ?? "null") ?? {};
  } catch {
    return undefined;
  }
  const ref = typeof root.a === "string" ? /^\$@([0-9a-f]+)$/.exec(root.a) : null;
  if (!ref) return root.a;
  try {
    return JSON.parse(rows.get(ref[1]!) ?? "null");
  } catch {
    return undefined;
  }
}
