import { expect, test, type Page } from "@playwright/test";
import { signIn, snap } from "./helpers";

type Point = {
  tag: string;
  sealedForLife: boolean;
  foodGradeRequired: boolean;
  changeover: unknown;
  currentGrease: { code: string } | null;
};
type Grease = { id: number; code: string; name: string; packs: { id: number; netMassGrams: number }[] };

const GREASE = "GL-EM2";
// A small but real PDF: the server checks the content, not the name.
const PDF = Buffer.from(
  "%PDF-1.4\n1 0 obj<</Type/Catalog/Pages 2 0 R>>endobj\n2 0 obj<</Type/Pages/Kids[]/Count 0>>endobj\ntrailer<</Root 1 0 R>>\n%%EOF\n",
);

async function findPoint(page: Page): Promise<Point> {
  const list = (await (await page.request.get("/api/v1/points")).json()) as { items: { tag: string }[] };
  for (const item of list.items) {
    const point = (await (await page.request.get(`/api/v1/points/${item.tag}`)).json()) as Point;
    if (
      point.currentGrease?.code === GREASE &&
      !point.sealedForLife &&
      !point.foodGradeRequired &&
      !point.changeover
    )
      return point;
  }
  throw new Error(`no point holding ${GREASE}`);
}

/** The lead fixes the grease's reorder point at Kestrel Bay through the stock page's settings form. */
async function setReorderPoint(page: Page, kg: string) {
  await page.goto("/stock");
  await page.waitForLoadState("networkidle");
  const form = page.getByRole("form", { name: "Reorder settings" });
  await form.getByLabel("Site").selectOption({ label: "Kestrel Bay Cement Works" });
  await form.getByLabel("Grease").selectOption({ label: `Brackenridge Aurum EM2 (${GREASE})` });
  await form.getByLabel("Fixed reorder point (kg)").fill(kg);
  await form.getByRole("button", { name: "Save the reorder settings" }).click();
  await expect(form.getByText("Reorder settings saved.")).toBeVisible();
}

async function greaseGramsAtKestrelBay(page: Page, grease: Grease): Promise<number> {
  const stock = (await (await page.request.get("/api/v1/stock")).json()) as {
    items: { greaseId: number; packId: number; site: string; onHand: number }[];
  };
  const grams = new Map(grease.packs.map((p) => [p.id, p.netMassGrams]));
  return stock.items
    .filter((i) => i.greaseId === grease.id && i.site === "KBC")
    .reduce((n, i) => n + i.onHand * (grams.get(i.packId) ?? 0), 0);
}

test("the clerk receives a lot and prints its labels; the technician scans one at a point; stock drops and the reorder mail arrives", async ({
  browser,
}) => {
  test.setTimeout(180_000);
  const started = new Date();
  const leadContext = await browser.newContext();
  const lead = await leadContext.newPage();
  await signIn(lead, "lead@example.com");
  const grease = (
    (await (await lead.request.get("/api/v1/greases")).json()) as { items: Grease[] }
  ).items.find((g) => g.code === GREASE)!;
  // No reorder point while the delivery comes in: any low-stock episode of this grease ends with the receipt.
  await setReorderPoint(lead, "0");

  const clerkContext = await browser.newContext();
  const clerk = await clerkContext.newPage();
  await signIn(clerk, "clerk@example.com");
  await clerk.goto("/stock/receive");
  await clerk.waitForLoadState("networkidle");
  const lotNumber = `E2E-${Date.now().toString(36).toUpperCase()}`;
  await clerk.getByLabel("Grease").selectOption({ label: `Brackenridge Aurum EM2 (${GREASE})` });
  await clerk.getByLabel("Containers received").fill("two");
  await clerk.getByLabel("Lot number (from the label)").fill(lotNumber);
  await clerk.getByLabel("Expires on (optional)").fill("2029-03-31");
  await clerk
    .getByLabel("Delivery note (PDF, optional)")
    .setInputFiles({ name: "delivery-note.pdf", mimeType: "application/pdf", buffer: PDF });
  await clerk.getByRole("button", { name: "Receive and print labels" }).click();
  // A bad value is named under its field and what was typed stays.
  await expect(clerk.getByText("Enter containers received as a number.")).toBeVisible();
  await expect(clerk.getByLabel("Lot number (from the label)")).toHaveValue(lotNumber);
  await clerk.getByLabel("Containers received").fill("2");
  await clerk
    .getByLabel("Delivery note (PDF, optional)")
    .setInputFiles({ name: "delivery-note.pdf", mimeType: "application/pdf", buffer: PDF });
  await snap(clerk, "stock-receive");
  await clerk.getByRole("button", { name: "Receive and print labels" }).click();
  await expect(clerk).toHaveURL(/\/stock\/lots\/[0-9A-Z]{8}\?received=2$/, { timeout: 20_000 });
  const labelCode = /\/stock\/lots\/([0-9A-Z]{8})/.exec(clerk.url())![1]!;
  await expect(clerk.getByRole("heading", { level: 1 })).toContainText(lotNumber);
  await expect(clerk.getByTestId("lot-on-hand")).toContainText("2 cartridge");
  await expect(clerk.getByRole("link", { name: "Download (PDF)" })).toBeVisible();
  await snap(clerk, "stock-lot");
  await clerk.getByRole("link", { name: "Print labels" }).click();
  await expect(clerk.getByTestId("container-label")).toHaveCount(2);
  await expect(clerk.getByTestId("container-label").first()).toContainText(labelCode);
  await expect(clerk.getByTestId("container-label").first()).toContainText(`Lot ${lotNumber}`);
  await clerk.emulateMedia({ media: "print" });
  await snap(clerk, "stock-labels-print");
  await clerk.emulateMedia({ media: "screen" });

  // Now one container less than what is there would take the grease below its reorder point.
  const grams = await greaseGramsAtKestrelBay(lead, grease);
  expect(grams).toBeGreaterThan(0);
  await setReorderPoint(lead, String((grams - 200) / 1000));

  const techContext = await browser.newContext({ viewport: { width: 390, height: 844 }, hasTouch: true });
  const tech = await techContext.newPage();
  await signIn(tech, "tech@example.com");
  const point = await findPoint(tech);
  const labelPng = await (await tech.request.get(`/api/v1/stock/labels/${labelCode}/qr.png`)).body();
  await tech.goto(`/points/${point.tag}`);
  await tech.waitForLoadState("networkidle");
  await tech.getByText("Scan the container label (optional)").click();
  await tech
    .getByLabel("Or scan a photo of the container label")
    .setInputFiles({ name: "label.png", mimeType: "image/png", buffer: labelPng });
  const scanned = tech.getByTestId("scanned-container");
  await expect(scanned).toContainText(lotNumber, { timeout: 20_000 });
  await expect(tech.getByLabel("Grease in your hand")).toHaveValue(String(grease.id));
  await expect(tech.getByLabel(/Book a new container out of the store/)).toBeChecked();
  await tech.getByLabel("Grams", { exact: true }).check();
  await tech.getByLabel("Grams applied").fill("6");
  await scanned.scrollIntoViewIfNeeded();
  await snap(tech, "phone-service-container");
  await tech.getByRole("button", { name: "Check the grease and record" }).click();
  await expect(tech.getByText("Service recorded")).toBeVisible();
  await expect(tech.getByText(`Lot ${lotNumber}: one container booked out of the store.`)).toBeVisible();

  const label = (await (await clerk.request.get(`/api/v1/stock/labels/${labelCode}`)).json()) as {
    onHand: number;
  };
  expect(label.onHand).toBe(1);
  await clerk.goto(`/stock/lots/${labelCode}`);
  await expect(clerk.getByTestId("lot-movements")).toContainText("⊖ issued");
  await expect(clerk.getByTestId("lot-on-hand")).toContainText("1 cartridge");

  const inbox = process.env.MAIL_FAKE_URL!;
  await expect
    .poll(
      async () => {
        const messages = (await (await fetch(`${inbox}/messages`)).json()) as {
          subject: string;
          text: string;
          date: string;
        }[];
        return messages.filter(
          (m) =>
            m.subject.startsWith(`Reorder ${grease.name}`) &&
            new Date(m.date) >= new Date(started.getTime() - 1000),
        ).length;
      },
      { timeout: 30_000, message: "the reorder mail reaches the fake inbox" },
    )
    .toBe(1);

  await leadContext.close();
  await clerkContext.close();
  await techContext.close();
});
