import { jsonResponse } from "@/lib/server/json-response";
import { apiRoute } from "@/lib/server/api";

export const dynamic = "force-dynamic";

export const GET = apiRoute({ action: "account.self" }, async ({ user }) =>
  jsonResponse({ user: { id: user.id, email: user.email, name: user.name, role: user.role } }),
);
