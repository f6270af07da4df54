import { expect, test, type Page } from "@playwright/test";
import { signIn, snap } from "./helpers";

type Point = { tag: string; due: string; sealedForLife: boolean; foodGradeRequired: boolean; changeover: unknown; currentGrease: { code: string } | null };

async function findPoint(page: Page, greaseCode: string): Promise<Point> {
  const list = (await (await page.request.get("/api/v1/points")).json()) as { items: { tag: string }[] };
  for (const item of list.items.slice(0, 80)) {
    const point = (await (await page.request.get(`/api/v1/points/${item.tag}`)).json()) as Point;
    if (point.currentGrease?.code === greaseCode && !point.sealedForLife && !point.foodGradeRequired && !point.changeover) return point;
  }
  throw new Error(`no point holding ${greaseCode}`);
}

test.describe("on a phone", () => {
  test.use({ viewport: { width: 390, height: 844 }, hasTouch: true });

  test("the technician scans a tag from a photo, is refused an incompatible grease, then records the right one", async ({ page }) => {
    await signIn(page, "tech@example.com");
    const point = await findPoint(page, "GL-EM2");
    const png = await (await page.request.get(`/api/v1/points/${point.tag}/qr.png`)).body();

    await page.goto("/scan");
    await page.waitForLoadState("networkidle");
    await snap(page, "phone-scan");
    await page.getByLabel("Or scan a photo of the tag").setInputFiles({ name: "tag.png", mimeType: "image/png", buffer: png });
    await expect(page).toHaveURL(new RegExp(`/points/${point.tag}$`), { timeout: 20_000 });
    await expect(page.getByRole("heading", { level: 1 })).toBeVisible();
    await page.waitForLoadState("networkidle");

    await page.getByLabel("Grease in your hand").selectOption({ label: "Norrvik Fennel LX 2 (GL-LX2)" });
    await page.getByLabel("Grams", { exact: true }).check();
    await page.getByLabel("Grams applied").fill("12");
    await page.getByRole("button", { name: "Check the grease and record" }).click();
    const refused = page.getByTestId("service-refused");
    await expect(refused).toContainText("Stop: do not put this grease in.");
    await expect(refused).toContainText(/polyurea/i);
    await expect(refused).toContainText(/Mixing incident #\d+ was opened/);
    await refused.scrollIntoViewIfNeeded();
    await snap(page, "phone-service-refused");

    await page.getByLabel("Grease in your hand").selectOption({ label: "Brackenridge Aurum EM2 (GL-EM2)" });
    await page.getByLabel("Old grease purged out").check();
    await page.getByRole("button", { name: "Check the grease and record" }).click();
    await expect(page.getByText("Service recorded")).toBeVisible();
    await expect(page.getByTestId("service-refused")).toHaveCount(0);
    await snap(page, "phone-service-recorded");
  });

  test("a signed-out scan goes to sign-in and then on to the point", async ({ page, browser }) => {
    const helperContext = await browser.newContext();
    const helper = await helperContext.newPage();
    await signIn(helper, "tech@example.com");
    const point = await findPoint(helper, "GL-EM2");
    await helperContext.close();

    await page.goto(`/p/${point.tag}`);
    await expect(page).toHaveURL(/\/sign-in\?next=/);
    await page.waitForLoadState("networkidle");
    await page.getByLabel("E-mail address").fill("tech@example.com");
    await page.getByLabel("Password").fill("demo-grease-2026");
    await page.getByRole("button", { name: "Sign in" }).click();
    await expect(page).toHaveURL(new RegExp(`/points/${point.tag}$`));
  });
});

test("the lead prints a tag sheet for an area", async ({ page }) => {
  await signIn(page, "lead@example.com");
  await page.goto("/points/tags");
  await page.getByLabel("Area").selectOption({ index: 1 });
  await page.getByRole("button", { name: "Show the sheet" }).click();
  const sheet = page.getByTestId("tag-sheet");
  await expect(sheet.locator("figure").first()).toBeVisible();
  expect(await sheet.locator("figure svg").count()).toBeGreaterThan(5);
  await expect(sheet.locator("figcaption").first()).toContainText(/[0-9A-Z]{8}/);
  await snap(page, "tag-sheet");
  await page.emulateMedia({ media: "print" });
  await snap(page, "tag-sheet-print");
  await expect(page.getByRole("button", { name: "Print" })).toBeHidden();
});

test("the points list sorts overdue first and opens a point with its plan and steps", async ({ page }) => {
  await signIn(page, "lead@example.com");
  await page.goto("/points");
  await page.getByLabel("State").selectOption("overdue");
  const first = page.locator("tbody tr").first();
  await expect(first).toContainText("Overdue");
  await snap(page, "points-list");
  await first.getByRole("link").click();
  await expect(page.getByRole("heading", { name: "Plan" })).toBeVisible();
  await expect(page.getByText(/Relubrication interval:/)).toBeVisible();
  await snap(page, "point-detail");
});

test("the technician's overview lists due points and the route sheet groups them by area", async ({ page }) => {
  await signIn(page, "tech@example.com");
  await expect(page.getByRole("heading", { name: /Due and overdue on your sites/ })).toBeVisible();
  await snap(page, "overview-technician-due");
  await page.goto("/points/route?days=7");
  await expect(page.getByTestId("route-sheet").locator("h3").first()).toBeVisible();
  await snap(page, "route-sheet");
});
