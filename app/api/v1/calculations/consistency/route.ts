import { jsonResponse } from "@/lib/server/json-response";
import { nlgiGradeFromPenetration } from "@/lib/domain/consistency";
import { apiRoute } from "@/lib/server/api";
import { consistencySchema } from "@/lib/validation/compatibility";

export const dynamic = "force-dynamic";

/** NLGI grade from worked penetration (0.1 mm); a value between two grades is answered as `between`. */
export const POST = apiRoute({ action: "calculations.use", body: consistencySchema }, async ({ body }) => {
  const result = nlgiGradeFromPenetration(body.workedPenetration);
  return jsonResponse({ nlgiGrade: result.nlgiGrade, ...(result.between ? { between: result.between } : {}) });
});
