import { readFileSync } from "node:fs";
import { expect, test } from "@playwright/test";
import { signIn, snap } from "./helpers";

test("the auditor exports the service history from the lube points page; a bad period is named under its field", async ({
  page,
}) => {
  test.setTimeout(90_000);
  await signIn(page, "auditor@example.com");
  await page.goto("/points");
  await page.waitForLoadState("networkidle");
  const form = page.getByRole("form", { name: "Export the service history" });
  await expect(page.getByRole("heading", { name: "Service history" })).toBeVisible();

  await form.getByLabel("From").fill("2030-01-02");
  await form.getByLabel("To").fill("2030-01-01");
  await form.getByRole("button", { name: "Download service history (CSV)" }).click();
  await expect(form.getByText("from (2030-01-02) must not be after to (2030-01-01).")).toBeVisible();
  await expect(form.getByLabel("From")).toHaveAttribute("aria-invalid", "true");

  const today = new Date().toISOString().slice(0, 10);
  await form.getByLabel("From").fill(new Date(Date.now() - 30 * 86_400_000).toISOString().slice(0, 10));
  await form.getByLabel("To").fill(today);
  const download = page.waitForEvent("download");
  await form.getByRole("button", { name: "Download service history (CSV)" }).click();
  const file = await download;
  expect(file.suggestedFilename()).toBe(`greaseledger-services-${today}.csv`);
  const lines = readFileSync((await file.path())!, "utf8").split("\r\n");
  expect(lines[0]).toMatch(/^\uFEFFService id,Performed at \(UTC\),Site,/);
  expect(lines.length).toBeGreaterThan(3);
  await expect(form.getByText(/saved: \d+ services\./)).toBeVisible();
  await snap(page, "points-service-export");
});

test("a technician sees no service-history export on the lube points page", async ({ page }) => {
  await signIn(page, "tech@example.com");
  await page.goto("/points");
  await expect(page.getByRole("heading", { name: "Lube points", level: 1 })).toBeVisible();
  await expect(page.getByRole("heading", { name: "Service history" })).toHaveCount(0);
});
