import { expect, test } from "@playwright/test";
import { signIn, snap } from "./helpers";

type Grease = { id: number; code: string; name: string; packs: { id: number; kind: string; netMassGrams: number }[] };

test("the clerk issues containers at phone size: a chosen lot goes out, too many is refused with the reason, the form keeps its values", async ({
  browser,
  baseURL,
}) => {
  test.setTimeout(120_000);
  const context = await browser.newContext({ viewport: { width: 390, height: 844 }, hasTouch: true });
  const clerk = await context.newPage();
  await signIn(clerk, "clerk@example.com");
  await clerk.goto("/stock/issue");
  await clerk.waitForLoadState("networkidle");
  const location = await clerk.locator("#issue-location option").first().getAttribute("value");
  expect(location).toBeTruthy();

  // A lot of our own at that store (through the public API), so the test does not depend on what other tests issued.
  const greases = ((await (await clerk.request.get("/api/v1/greases")).json()) as { items: Grease[] }).items;
  const grease = [...greases].reverse().find((g) => g.code !== "GL-EM2" && g.packs.length > 0)!;
  const pack = grease.packs[0]!;
  const lotNumber = `E2E-ISS-${Date.now().toString(36).toUpperCase()}`;
  const receipt = await clerk.request.post("/api/v1/stock/receipts", {
    headers: { origin: baseURL! },
    data: { greaseId: grease.id, packId: pack.id, quantity: 3, lotNumber, expiresOn: "2031-01-31", location },
  });
  expect(receipt.status()).toBe(201);
  const lotsAtStore = async () =>
    ((await (
      await clerk.request.get(
        `/api/v1/stock/lots?${new URLSearchParams({ greaseId: String(grease.id), packId: String(pack.id), location: location! })}`,
      )
    ).json()) as { items: { lotNumber: string; onHand: number }[] }).items;
  const lots = await lotsAtStore();
  const ours = lots.find((l) => l.lotNumber === lotNumber)!;
  expect(ours.onHand).toBe(3);
  const inStore = lots.reduce((n, l) => n + l.onHand, 0);

  const form = clerk.getByRole("form", { name: "Issue containers" });
  await form.getByLabel("Grease").selectOption(String(grease.id));
  await form.getByLabel("Pack").selectOption(String(pack.id));
  await form.getByLabel("From").selectOption(location!);
  const ourLot = form.getByLabel(new RegExp(`Lot ${lotNumber}`));
  await expect(ourLot).toBeVisible();
  await ourLot.check();
  await form.getByLabel("Containers").fill("2");
  await form.getByRole("button", { name: "Issue", exact: true }).click();
  const issued = form.getByRole("status").filter({ hasText: "Issued" });
  await expect(issued).toBeVisible();
  await expect(issued).toContainText(`2 from lot ${lotNumber}`);
  // The lot list follows: one left of ours.
  await expect(form.getByLabel(new RegExp(`Lot ${lotNumber}`))).toBeVisible();
  await expect(form.locator("label", { hasText: `Lot ${lotNumber}` })).toContainText("1 at");
  await snap(clerk, "stock-issue-done");

  // More than the store holds: refused with the reason, and the typed values stay.
  await form.getByLabel("The lots that expire first (automatic)").check();
  await form.getByLabel("Containers").fill(String(inStore + 5));
  await form.getByRole("button", { name: "Issue", exact: true }).click();
  const refused = form.getByRole("alert").filter({ hasText: "Not issued" });
  await expect(refused).toBeVisible();
  await expect(refused).toContainText(/Only \d+ usable container\(s\) of this grease and pack are in stock/);
  await expect(form.getByLabel("Containers")).toHaveValue(String(inStore + 5));
  await expect(form.getByLabel("Grease")).toHaveValue(String(grease.id));
  await snap(clerk, "stock-issue-refused");

  // Nothing of the refused issue was written: our lot still holds one.
  expect((await lotsAtStore()).find((l) => l.lotNumber === lotNumber)!.onHand).toBe(1);
  await context.close();
});
