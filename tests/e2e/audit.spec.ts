import { readFileSync } from "node:fs";
import { expect, test, type Page } from "@playwright/test";
import { signIn, snap } from "./helpers";

const WRITE_WORDS =
  /^(save|receive|issue|record|close|reopen|report a|import|add|create|delete|move|scrap|cancel|mark|edit|plan (a|the)|upload|invite|disable|enable|post|book|start|check the grease)/i;

async function buttonsOn(page: Page): Promise<string[]> {
  return page
    .locator("main button, main a, main input[type=submit]")
    .evaluateAll((els) =>
      els
        .filter((e) => (e as HTMLElement).offsetParent !== null)
        .map((e) => (e.textContent ?? (e as HTMLInputElement).value ?? "").trim()),
    );
}

test("the same look-up finds the lead's buttons that change things (so the auditor's check below can fail)", async ({
  page,
}) => {
  await signIn(page, "lead@example.com");
  await page.goto("/incidents");
  await page.waitForLoadState("networkidle");
  expect((await buttonsOn(page)).filter((b) => WRITE_WORDS.test(b))).toContain("Report a mix found");
  await page.goto("/stock");
  await page.waitForLoadState("networkidle");
  expect((await buttonsOn(page)).filter((b) => WRITE_WORDS.test(b))).toEqual(
    expect.arrayContaining(["Receive", "Issue"]),
  );
});

test("the auditor filters the incidents, downloads CSV and PDF, verifies the chain, and finds nothing that changes anything", async ({
  page,
}) => {
  test.setTimeout(120_000);
  await signIn(page, "auditor@example.com");
  await page.goto("/incidents");
  await page.waitForLoadState("networkidle");
  await expect(page.getByTestId("incident-table")).toBeVisible();
  await page.getByLabel("State").selectOption("closed");
  await page.getByRole("button", { name: "Show" }).click();
  await expect(page).toHaveURL(/state=closed/);
  const rows = page.getByTestId("incident-table").locator("tbody tr");
  await expect(rows.first()).toBeVisible();
  for (const text of await rows.allTextContents()) expect(text).toContain("Closed");
  await snap(page, "incidents-list");

  const csvDownload = page.waitForEvent("download");
  await page.getByRole("button", { name: "Download CSV" }).click();
  const csv = await csvDownload;
  expect(csv.suggestedFilename()).toMatch(/^greaseledger-incidents-\d{4}-\d{2}-\d{2}\.csv$/);
  const csvText = readFileSync((await csv.path())!, "utf8");
  expect(csvText.split("\r\n")[0]).toContain("id,opened_at,site");
  expect(csvText).toContain(",closed,");
  expect(csvText).not.toMatch(/,open,/);
  await expect(page.getByText(/saved: \d+ incident\(s\)/)).toBeVisible();

  const pdfDownload = page.waitForEvent("download");
  await page.getByRole("button", { name: "Download PDF report" }).click();
  const pdf = await pdfDownload;
  expect(
    readFileSync((await pdf.path())!)
      .subarray(0, 5)
      .toString(),
  ).toBe("%PDF-");

  expect((await buttonsOn(page)).filter((b) => WRITE_WORDS.test(b))).toEqual([]);

  await rows.first().getByRole("link").first().click();
  await expect(page.getByRole("heading", { level: 1 })).toContainText("Incident #");
  await expect(page.getByTestId("incident-timeline")).toContainText("Closed");
  await expect(page.getByText("The lubrication lead investigates and closes it.")).toBeVisible();
  expect((await buttonsOn(page)).filter((b) => WRITE_WORDS.test(b))).toEqual([]);
  await snap(page, "incident-detail");

  await page.goto("/audit");
  await page.waitForLoadState("networkidle");
  await page.getByRole("button", { name: "Verify the chain" }).click();
  await expect(page.getByText("The chain is intact")).toBeVisible({ timeout: 30_000 });
  await expect(page.getByTestId("audit-table")).toContainText("incident.exported");
  await snap(page, "audit-verified");

  for (const path of ["/stock", "/catalogue", "/points", "/compatibility"]) {
    await page.goto(path);
    await page.waitForLoadState("networkidle");
    expect(
      (await buttonsOn(page)).filter((b) => WRITE_WORDS.test(b)),
      path,
    ).toEqual([]);
  }
});
