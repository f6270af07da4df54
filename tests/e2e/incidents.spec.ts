import { expect, test } from "@playwright/test";
import { signIn, snap } from "./helpers";

test("the lead reports a mix found in a point, investigates, is told what closing needs, then closes it", async ({ page }) => {
  await signIn(page, "lead@example.com");
  const list = (await (await page.request.get("/api/v1/points")).json()) as { items: { tag: string }[] };
  const tag = list.items[7]!.tag;
  await page.goto(`/incidents/report?point=${tag}`);
  await page.waitForLoadState("networkidle");
  await expect(page.getByLabel("Lube point tag")).toHaveValue(tag);
  await page.getByLabel("Grease found in the point").selectOption({ label: "Vessery Fluoro KP2 (GL-PF2)" });
  await page.getByLabel("What was found").fill("no");
  await page.getByRole("button", { name: "Report the incident" }).click();
  await expect(page.getByText("Say what was found (at least 5 characters).")).toBeVisible();
  await page.getByLabel("What was found").fill("White paste at the purge port of the drive end.");
  await page.getByRole("button", { name: "Report the incident" }).click();
  await expect(page).toHaveURL(/\/incidents\/\d+$/);
  await expect(page.getByTestId("incident-timeline")).toContainText("White paste at the purge port");

  await page.getByLabel("What you will check (optional)").fill("Ask which gun was used");
  await page.getByRole("button", { name: "Start the investigation" }).click();
  await expect(page.getByText("Investigation started.")).toBeVisible();
  await expect(page.getByTestId("incident-timeline")).toContainText("Ask which gun was used");

  await page.getByRole("button", { name: "Close the incident" }).click();
  await expect(page.getByText("Give the root cause before closing.")).toBeVisible();
  await expect(page.getByText("Give the corrective action before closing.")).toBeVisible();
  await page.getByLabel("Root cause").fill("A contractor's gun still held a PFPE grease.");
  await page.getByLabel("Corrective action").fill("Housing cleaned out and repacked; contractor guns issued from our store only.");
  await page.getByRole("button", { name: "Close the incident" }).click();
  await expect(page.getByText("Incident closed.")).toBeVisible();
  await expect(page.getByTestId("incident-timeline")).toContainText("Root cause: A contractor's gun still held a PFPE grease.");
  await expect(page.getByRole("button", { name: "Reopen" })).toBeVisible();
  await snap(page, "incident-closed-by-lead");
});
