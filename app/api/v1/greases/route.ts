import { apiRoute } from "@/lib/server/api";
import { createGrease, listGreases } from "@/lib/server/queries/greases";
import { greaseSchema } from "@/lib/validation/grease";

export const dynamic = "force-dynamic";

export const GET = apiRoute({ action: "catalogue.read" }, async () => Response.json({ items: await listGreases() }));

export const POST = apiRoute({ action: "catalogue.write", body: greaseSchema }, async ({ body, user }) =>
  Response.json(await createGrease(body, user.id), { status: 201 }),
);
