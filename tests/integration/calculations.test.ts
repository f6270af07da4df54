import { beforeAll, describe, expect, it } from "vitest";
import { Client } from "./helpers";

const tech = new Client();
beforeAll(async () => {
  await tech.signIn("tech@example.com");
});

describe("calculation API (nothing stored)", () => {
  it("relubrication: a 6310 ball bearing at 1480 r/min", async () => {
    // T = 10·(14e6/(1480·√50) − 4·50) = 10·(1337.7 − 200) ≈ 11 377 h at 70 °C, doubled once at ≤ 55 °C → ≈ 22 754 h
    // (empirical formula, The Tribology Handbook §A20 Table 20.4; SKF Rolling bearings Table 2 temperature rule).
    const response = await tech.request("POST", "/api/v1/calculations/relubrication", {
      json: { bearingType: "ball", boreMm: 50, outsideDiameterMm: 110, widthMm: 27, speedRpm: 1480, operatingTemperatureC: 50, gunGramsPerStroke: 1.2 },
    });
    expect(response.status).toBe(200);
    expect(response.body.intervalHours).toBeGreaterThan(22_000);
    expect(response.body.intervalHours).toBeLessThan(23_500);
    // G = 0.005·D·B = 0.005 × 110 × 27 = 14.85 g; 14.85 / 1.2 ≈ 12 strokes
    expect(response.body.quantityGrams).toBeCloseTo(14.85, 1);
    expect(response.body.strokes).toBe(12);
    expect(response.body.steps.length).toBeGreaterThan(5);
    expect(typeof response.body.method).toBe("string");
  });

  it("relubrication names bad fields", async () => {
    const response = await tech.request("POST", "/api/v1/calculations/relubrication", { json: { bearingType: "roller", boreMm: -1, outsideDiameterMm: 10, widthMm: 5, speedRpm: 0 } });
    expect(response.status).toBe(400);
    for (const f of ["bearingType", "boreMm", "speedRpm"]) expect(response.body.error.fields).toHaveProperty([f]);
  });

  it("viscosity: ISO VG, viscosity at temperature, ν1 and κ", async () => {
    const response = await tech.request("POST", "/api/v1/calculations/viscosity", {
      json: { viscosity40: 100, viscosity100: 11, temperatureC: 70, speedRpm: 1480, meanDiameterMm: 80 },
    });
    expect(response.status).toBe(200);
    expect(response.body.isoVg).toBe(100);
    expect(response.body.viscosityAtTemperature).toBeGreaterThan(11);
    expect(response.body.viscosityAtTemperature).toBeLessThan(100);
    expect(response.body.kappa).toBeCloseTo(response.body.viscosityAtTemperature / response.body.ratedViscosity, 2);
  });

  it("viscosity answers isoVg null in a gap between grades (ISO 3448)", async () => {
    const response = await tech.request("POST", "/api/v1/calculations/viscosity", { json: { viscosity40: 125 } });
    expect(response.body).toEqual({ isoVg: null });
  });
});
