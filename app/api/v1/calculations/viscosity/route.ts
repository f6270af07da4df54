import { jsonResponse } from "@/lib/server/json-response";
import { isoViscosityGrade, ratedViscosity, viscosityAtTemperature, viscosityIndex, viscosityRatio } from "@/lib/domain/viscosity";
import { apiRoute } from "@/lib/server/api";
import { viscosityCalcSchema } from "@/lib/validation/calculations";

export const dynamic = "force-dynamic";

/** ISO VG, and with more inputs the viscosity index, viscosity at temperature, ν1 and κ. Nothing is stored. */
export const POST = apiRoute({ action: "calculations.use", body: viscosityCalcSchema }, async ({ body }) => {
  const out: Record<string, number | null> = { isoVg: isoViscosityGrade(body.viscosity40) };
  if (body.viscosity100 !== undefined) {
    const vi = viscosityIndex({ viscosity40: body.viscosity40, viscosity100: body.viscosity100 });
    if (vi.viscosityIndex !== null) out.viscosityIndex = vi.viscosityIndex;
    if (body.temperatureC !== undefined) {
      const at = viscosityAtTemperature({ viscosity40: body.viscosity40, viscosity100: body.viscosity100, temperatureC: body.temperatureC });
      if (at.viscosity !== null) out.viscosityAtTemperature = at.viscosity;
    }
  }
  if (body.speedRpm !== undefined && body.meanDiameterMm !== undefined) {
    const rated = ratedViscosity({ meanDiameterMm: body.meanDiameterMm, speedRpm: body.speedRpm });
    if (rated.viscosity !== null) {
      out.ratedViscosity = rated.viscosity;
      if (out.viscosityAtTemperature !== undefined && out.viscosityAtTemperature !== null) {
        out.kappa = viscosityRatio({ viscosity: out.viscosityAtTemperature, ratedViscosity: rated.viscosity }).kappa;
      }
    }
  }
  return jsonResponse(out);
});
