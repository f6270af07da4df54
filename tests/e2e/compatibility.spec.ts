import { expect, test } from "@playwright/test";
import { signIn, snap } from "./helpers";

test("the lead checks a pair that comes back incompatible and reads the reasons", async ({ page }) => {
  await signIn(page, "lead@example.com");
  await page.getByRole("link", { name: "Compatibility", exact: true }).click();
  await expect(page.getByRole("heading", { name: "Thickener compatibility" })).toBeVisible();
  await page.getByRole("button", { name: "Lithium complex with Polyurea: Incompatible" }).click();
  await expect(page.getByTestId("matrix-cell-detail")).toContainText("FIST 2-4");
  await snap(page, "compatibility-matrix");

  await expect(page.getByRole("link", { name: "Check a pair" }).first()).toHaveAttribute("href", "/compatibility/check");
  await page.goto("/compatibility/check");
  await page.waitForLoadState("networkidle"); // typed input before hydration would be lost
  const inBearing = page.getByRole("group", { name: "Grease in the bearing" });
  const toAdd = page.getByRole("group", { name: "Grease to add" });
  await inBearing.getByLabel("Product", { exact: true }).selectOption({ label: "Brackenridge Aurum EM2 (GL-EM2)" });
  await toAdd.getByLabel("Product", { exact: true }).selectOption({ label: "Norrvik Fennel LX 2 (GL-LX2)" });
  await page.getByRole("button", { name: "Check this pair" }).click();
  const result = page.getByRole("region", { name: "Result" });
  await expect(result.getByText("Incompatible").first()).toBeVisible();
  await expect(page.getByTestId("mixing-decision")).toHaveText("Do not mix these greases.");
  await expect(result.getByText(/Lithium complex and polyurea|polyurea and lithium complex/i).first()).toBeVisible();
  await snap(page, "pair-check-incompatible");

  await toAdd.getByLabel("Product", { exact: true }).selectOption({ label: "Brackenridge Aurum EM2 (GL-EM2)" });
  await page.getByRole("button", { name: "Check this pair" }).click();
  await expect(page.getByTestId("mixing-decision")).toHaveText("Mixing is allowed.");
});

test("a technician checks typed-in properties on a phone", async ({ page }) => {
  await page.setViewportSize({ width: 390, height: 844 });
  await signIn(page, "tech@example.com");
  await page.goto("/compatibility/check");
  await page.waitForLoadState("networkidle");
  const inBearing = page.getByRole("group", { name: "Grease in the bearing" });
  const toAdd = page.getByRole("group", { name: "Grease to add" });
  await inBearing.getByLabel("Properties typed in").check();
  await inBearing.getByLabel("Base oil").selectOption("mineral");
  await toAdd.getByLabel("Properties typed in").check();
  await toAdd.getByLabel("Base oil").selectOption("pag");
  await page.getByRole("button", { name: "Check this pair" }).click();
  await expect(page.getByTestId("mixing-decision")).toHaveText("Do not mix these greases.");
  await snap(page, "phone-pair-check");
});
