import { expect, test } from "@playwright/test";
import { signIn, snap } from "./helpers";

test("the lead adds a grease: a bad value is explained under its field, then the fixed grease is saved", async ({ page }) => {
  const code = `E2E-${Date.now().toString(36)}`;
  await signIn(page, "lead@example.com");
  await page.getByRole("link", { name: "Grease catalogue" }).click();
  await expect(page.getByTestId("grease-row-GL-EM2")).toBeVisible();
  await snap(page, "catalogue");

  await expect(page.getByRole("link", { name: "Add a grease" })).toHaveAttribute("href", "/catalogue/new");
  await page.goto("/catalogue/new");
  await page.waitForLoadState("networkidle"); // typed text before hydration would be reset to the defaults
  await page.getByLabel("Code", { exact: true }).fill(code);
  await page.getByLabel("Product name").fill("Kittering Test EP2");
  await page.getByLabel("Supplier").fill("Brackenridge Lubricants");
  await page.getByLabel("Thickener").selectOption("polyurea");
  await page.getByLabel("Base-oil viscosity at 40 °C (mm²/s)").fill("-5");
  await page.getByLabel("Worked penetration, 60 strokes (0.1 mm)").fill("330");
  await page.getByRole("button", { name: "Add the grease" }).click();
  await expect(page.getByText("Viscosity at 40 °C (mm²/s) must be more than 0.")).toBeVisible();
  await expect(page.getByText(/A worked penetration of 330 \(0.1 mm\) is NLGI 1, not the grade 2/)).toBeVisible();
  await snap(page, "grease-form-errors");

  await page.getByLabel("Base-oil viscosity at 40 °C (mm²/s)").fill("220");
  await page.getByLabel("Worked penetration, 60 strokes (0.1 mm)").fill("280");
  await page.getByRole("button", { name: "Add the grease" }).click();
  await expect(page.getByRole("heading", { name: "Kittering Test EP2" })).toBeVisible();
  await expect(page.getByText("220 mm²/s (ISO VG 220)")).toBeVisible();
  await snap(page, "grease-detail");
});

test("a technician reads the catalogue but cannot change it", async ({ page }) => {
  await signIn(page, "tech@example.com");
  await page.goto("/catalogue");
  await expect(page.getByTestId("grease-row-GL-LX2")).toBeVisible();
  await expect(page.getByRole("link", { name: "Add a grease" })).toHaveCount(0);
  await page.goto("/catalogue/new");
  await expect(page.getByText("Not available to your role")).toBeVisible();
});

test("the catalogue filters by thickener and sorts by viscosity", async ({ page }) => {
  await signIn(page, "auditor@example.com");
  await page.goto("/catalogue");
  await page.getByLabel("Thickener").selectOption("lithium_complex");
  await expect(page.getByTestId("grease-row-GL-LX2")).toBeVisible();
  await expect(page.getByTestId("grease-row-GL-EM2")).toHaveCount(0);
  await page.getByRole("button", { name: /ν 40 °C/ }).click();
  const first = page.locator("tbody tr").first();
  await expect(first).toContainText("Velora E2");
});
