import { existsSync, readdirSync, statSync } from "node:fs";
import path from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import { Client, ROOT, rootQuery } from "./helpers";

// Uploads (reliability.md §A.3 S23, S24): the type is decided by the content, an oversize file and a hand-made name
// are refused with a 4xx naming the field, and a refused upload leaves no file and no row behind.

const LIMIT = 10 * 1024 * 1024;
const UPLOAD_DIR = process.env.UPLOAD_DIR!;
const PDF = Buffer.from("%PDF-1.4\n1 0 obj<</Type/Catalog>>endobj\ntrailer<</Root 1 0 R>>\n%%EOF\n");
const PNG = Buffer.from("89504e470d0a1a0a0000000d4948445200000001000000010806000000", "hex");
const EXE = Buffer.from("MZ\x90\x00\x03\x00\x00\x00 this program cannot be run in DOS mode", "latin1");

const lead = new Client();
let greaseId = 0;

beforeAll(async () => {
  expect((await lead.signIn("lead@example.com")).status).toBe(200);
  const created = await lead.request("POST", "/api/v1/greases", {
    json: {
      code: `UP-${Date.now()}`,
      name: "Data sheet test grease",
      supplier: "Sheet Oils",
      thickener: "calcium_sulfonate",
      baseOilType: "mineral",
      viscosity40: 220,
      nlgiGrade: "2",
    },
  });
  expect(created.status).toBe(201);
  greaseId = created.body.id;
});

const files = () => {
  try {
    return readdirSync(UPLOAD_DIR).sort();
  } catch {
    return [];
  }
};
const publicFiles = () => {
  const out: string[] = [];
  const walk = (dir: string) => {
    for (const e of readdirSync(dir, { withFileTypes: true })) {
      if (e.isDirectory()) walk(path.join(dir, e.name));
      else out.push(path.join(dir, e.name));
    }
  };
  if (existsSync(path.join(ROOT, "public"))) walk(path.join(ROOT, "public"));
  return out.sort();
};
const count = async (table: string) =>
  Number((await rootQuery<{ n: bigint }>(`SELECT COUNT(*) AS n FROM ${table}`))[0]!.n);

/** What a refused upload must not change: the upload folder and the rows that point at a stored file. */
async function snapshot() {
  return {
    files: files(),
    documents: await count("stored_document"),
    sheets: await count("grease_document"),
    evidence: await count("grease_pair_evidence"),
  };
}

/** A multipart body written by hand, so the file name goes out byte for byte (FormData would escape it). */
function multipart(
  parts: { name: string; value?: string; filename?: string; type?: string; body?: Buffer }[],
) {
  const boundary = `----glUpload${Math.random().toString(16).slice(2)}`;
  const chunks: Buffer[] = [];
  for (const p of parts) {
    let head = `--${boundary}\r\nContent-Disposition: form-data; name="${p.name}"`;
    if (p.filename !== undefined)
      head += `; filename="${p.filename}"\r\nContent-Type: ${p.type ?? "application/pdf"}`;
    chunks.push(
      Buffer.from(`${head}\r\n\r\n`, "utf8"),
      p.body ?? Buffer.from(p.value ?? "", "utf8"),
      Buffer.from("\r\n"),
    );
  }
  chunks.push(Buffer.from(`--${boundary}--\r\n`));
  return { body: Buffer.concat(chunks), type: `multipart/form-data; boundary=${boundary}` };
}

async function post(
  pathname: string,
  form: { body: Buffer; type: string },
  options: { chunked?: boolean } = {},
) {
  const headers = {
    origin: new URL(lead.base).origin,
    cookie: [...lead.cookies].map(([k, v]) => `${k}=${v}`).join("; "),
    "content-type": form.type,
  };
  const body = options.chunked
    ? new ReadableStream<Uint8Array>({
        start(controller) {
          for (let i = 0; i < form.body.length; i += 1024 * 1024)
            controller.enqueue(new Uint8Array(form.body.subarray(i, i + 1024 * 1024)));
          controller.close();
        },
      })
    : new Uint8Array(form.body);
  const response = await fetch(new URL(pathname, lead.base), {
    method: "POST",
    headers,
    body,
    duplex: "half",
  } as RequestInit);
  const text = await response.text();
  return {
    status: response.status,
    body: JSON.parse(text) as {
      error?: { code: string; message: string; fields?: Record<string, string[]> };
      documentId?: number;
      id?: number;
    },
  };
}

const dataSheet = (file: { filename: string; body: Buffer; type?: string }) =>
  multipart([
    { name: "kind", value: "sds" },
    { name: "file", ...file },
  ]);
const sheetUrl = () => `/api/v1/greases/${greaseId}/documents`;

async function expectRefused(
  send: () => Promise<Awaited<ReturnType<typeof post>>>,
  status: number,
  message: RegExp,
) {
  const before = await snapshot();
  const response = await send();
  expect(response.status).toBe(status);
  expect(response.body.error!.fields!.file![0]).toMatch(message);
  expect(await snapshot()).toEqual(before);
  return response;
}

describe("uploads: renamed type (checked by content, not by name or declared type)", () => {
  it("a PDF renamed .exe → 415 naming file, nothing stored", async () => {
    const response = await expectRefused(
      () =>
        post(sheetUrl(), dataSheet({ filename: "sheet.exe", body: PDF, type: "application/x-msdownload" })),
      415,
      /named \.exe/,
    );
    expect(response.body.error!.code).toBe("unsupported_media_type");
  });

  it("a PNG declared as application/pdf and named .pdf → 415, nothing stored", async () => {
    await expectRefused(
      () => post(sheetUrl(), dataSheet({ filename: "safety-sheet.pdf", body: PNG, type: "application/pdf" })),
      415,
      /not a PDF/,
    );
  });

  it("an executable named letter.pdf sent as evidence → 415, no evidence row", async () => {
    const [a, b] = await rootQuery<{ id: number }>("SELECT id FROM grease ORDER BY id LIMIT 2");
    const payload = JSON.stringify({
      greaseAId: a!.id,
      greaseBId: b!.id,
      kind: "supplier_statement",
      verdict: "compatible",
      title: "Letter of 2026",
    });
    await expectRefused(
      () =>
        post(
          "/api/v1/compatibility/evidence",
          multipart([
            { name: "payload", value: payload },
            { name: "file", filename: "letter.pdf", body: EXE },
          ]),
        ),
      415,
      /not a PDF/,
    );
  });
});

describe("uploads: oversize", () => {
  const atLimit = Buffer.concat([PDF, Buffer.alloc(LIMIT - PDF.length, 0x20)]);
  const overLimit = Buffer.concat([atLimit, Buffer.from(" ")]);

  it("a file of the limit + 1 byte → 413 naming file and the limit, nothing stored", async () => {
    expect(overLimit.length).toBe(LIMIT + 1);
    const response = await expectRefused(
      () => post(sheetUrl(), dataSheet({ filename: "big.pdf", body: overLimit })),
      413,
      /10 MB/,
    );
    expect(response.body.error!.code).toBe("payload_too_large");
  });

  it("the same sent chunked, without Content-Length → 413, nothing stored", async () => {
    await expectRefused(
      () => post(sheetUrl(), dataSheet({ filename: "big.pdf", body: overLimit }), { chunked: true }),
      413,
      /10 MB/,
    );
  });

  it("a much larger body sent chunked is cut off at the limit → 413", async () => {
    const huge = Buffer.concat([overLimit, Buffer.alloc(8 * 1024 * 1024, 0x20)]);
    await expectRefused(
      () => post(sheetUrl(), dataSheet({ filename: "huge.pdf", body: huge }), { chunked: true }),
      413,
      /10 MB/,
    );
  });

  it("a file of exactly the limit is accepted (the form around it does not count)", async () => {
    const response = await post(sheetUrl(), dataSheet({ filename: "exactly-ten.pdf", body: atLimit }));
    expect(response.status).toBe(201);
    const [row] = await rootQuery<{ size_bytes: number }>(
      "SELECT size_bytes FROM stored_document WHERE id = ?",
      [response.body.documentId],
    );
    expect(Number(row!.size_bytes)).toBe(LIMIT);
  });
});

describe("uploads: path tricks in the file name", () => {
  it.each([
    ["a relative path", "../../x.pdf", /folder path/],
    ["a Windows relative path", "..\\..\\x.pdf", /folder path/],
    ["an absolute path", "/etc/cron.d/x.pdf", /folder path/],
    ["a Windows absolute path", "C:\\Windows\\x.pdf", /folder path/],
    ["a NUL byte", "sheet.pdf\u0000.png", /control characters/],
    ["a very long name", `${"n".repeat(300)}.pdf`, /longer than 255/],
    ["dots only", "..", /not a name/],
  ])("%s (%j) → 400 naming file, nothing stored", async (_label, filename, message) => {
    const response = await expectRefused(
      () => post(sheetUrl(), dataSheet({ filename, body: PDF })),
      400,
      message,
    );
    expect(response.body.error!.code).toBe("validation_failed");
  });
});

describe("uploads: stored under a generated name outside public/, served as an attachment (S24)", () => {
  it("a good upload is one new file, named by a UUID in UPLOAD_DIR, and nothing under public/", async () => {
    expect(path.relative(path.join(ROOT, "public"), path.resolve(UPLOAD_DIR)).startsWith("..")).toBe(true);
    const filesBefore = files();
    const publicBefore = publicFiles();
    const response = await post(
      sheetUrl(),
      dataSheet({ filename: "Sicherheitsdatenblatt Ölwanne.pdf", body: PDF }),
    );
    expect(response.status).toBe(201);
    const added = files().filter((f) => !filesBefore.includes(f));
    expect(added).toHaveLength(1);
    expect(added[0]).toMatch(/^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/);
    expect(statSync(path.join(UPLOAD_DIR, added[0]!)).size).toBe(PDF.length);
    const [row] = await rootQuery<{ stored_name: string; original_name: string }>(
      "SELECT stored_name, original_name FROM stored_document WHERE id = ?",
      [response.body.documentId],
    );
    expect(row).toEqual({ stored_name: added[0], original_name: "Sicherheitsdatenblatt Ölwanne.pdf" });
    expect(publicFiles()).toEqual(publicBefore);
  });

  it("the download is an attachment with nosniff and the stored bytes", async () => {
    const response = await fetch(new URL(`${sheetUrl()}/sds`, lead.base), {
      headers: { cookie: [...lead.cookies].map(([k, v]) => `${k}=${v}`).join("; ") },
    });
    expect(response.status).toBe(200);
    expect(response.headers.get("content-type")).toBe("application/pdf");
    expect(response.headers.get("content-disposition")).toMatch(
      /^attachment; filename="Sicherheitsdatenblatt _lwanne\.pdf"; filename\*=UTF-8''Sicherheitsdatenblatt%20%C3%96lwanne\.pdf$/,
    );
    expect(response.headers.get("x-content-type-options")).toBe("nosniff");
    expect(Buffer.from(await response.arrayBuffer()).equals(PDF)).toBe(true);
  });
});
