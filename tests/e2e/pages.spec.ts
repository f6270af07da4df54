import { expect, test } from "@playwright/test";
import { signIn, snap } from "./helpers";

const LEAD_PAGES = [
  ["/compatibility/evidence", "Evidence about product pairs", "evidence"],
  ["/compatibility/settings", "Compatibility settings", "compatibility-settings"],
  ["/catalogue/consolidation", "Consolidate products", "consolidation"],
  ["/catalogue/import", "Import greases from CSV", "catalogue-import"],
] as const;

test("the lead's catalogue and compatibility pages open and show their content", async ({ page }) => {
  await signIn(page, "lead@example.com");
  for (const [path, heading, shot] of LEAD_PAGES) {
    await page.goto(path);
    await expect(page.getByRole("heading", { name: heading, level: 1 })).toBeVisible();
    await snap(page, shot);
  }
  await page.goto("/compatibility/evidence");
  await expect(page.getByText(/Harrow CS2 with Fennel LX 2/).first()).toBeVisible();
  await expect(page.getByRole("cell", { name: "≈ dilution" }).first()).toBeVisible();
});

test("a lead imports a CSV: bad cells are marked before anything is written", async ({ page }) => {
  const code = `CSV-${Date.now().toString(36)}`;
  const header =
    "code,name,supplier,thickener,base_oil_type,viscosity_40_mm2s,viscosity_100_mm2s,nlgi_grade,worked_penetration,iso_vg,dropping_point_c,min_temperature_c,max_temperature_c,food_grade,solid_additives,shelf_life_months,packs,notes";
  const csv = [
    header,
    `${code}-A,Imported Alpha,Brackenridge Lubricants,lithium_complex,mineral,150,15,2,,,260,-20,140,none,,36,cartridge:400,`,
    `${code}-B,Imported Beta,Brackenridge Lubricants,unobtainium,mineral,abc,,9,,,,,,none,,,barrel:5,`,
  ].join("\n");
  await signIn(page, "lead@example.com");
  await page.goto("/catalogue/import");
  await page.waitForLoadState("networkidle");
  await page.getByLabel("CSV file").setInputFiles({ name: "greases.csv", mimeType: "text/csv", buffer: Buffer.from(csv) });
  await expect(page.getByText("Some rows need attention")).toBeVisible();
  await expect(page.getByTestId("import-line-3")).toContainText("✖ skipped");
  await expect(page.getByTestId("import-line-3")).toContainText("Choose the thickener type.");
  await expect(page.getByTestId("import-line-2")).toContainText("✔ ok");
  await snap(page, "catalogue-import-preview");
  await page.getByRole("button", { name: "Import 1 row(s)" }).click();
  await expect(page.getByText("1 grease(s) were added")).toBeVisible();
  await page.goto("/catalogue");
  await expect(page.getByTestId(`grease-row-${code}-A`)).toBeVisible();
  await expect(page.getByTestId(`grease-row-${code}-B`)).toHaveCount(0);
});

test("a grease's page shows its compatibility with every other product", async ({ page }) => {
  await signIn(page, "tech@example.com");
  await page.goto("/catalogue");
  await page.getByRole("link", { name: "Norrvik Fennel LX 2" }).click();
  await expect(page.getByRole("heading", { name: "Compatibility with every other product" })).toBeVisible();
  await expect(page.getByRole("region", { name: "incompatible with this grease" })).toContainText("Brackenridge Aurum EM2");
  await snap(page, "grease-detail-glance");
});
