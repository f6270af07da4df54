import { expect, test } from "@playwright/test";
import { signIn, snap } from "./helpers";

test("the lead adds a lube point: a wrong dimension is explained, then the point opens with its calculated plan", async ({ page }) => {
  await signIn(page, "lead@example.com");
  await page.goto("/points/plant");
  await expect(page.getByTestId("plant-tree")).toContainText("Kestrel Bay Cement Works");
  await snap(page, "plant-tree");

  await page.goto("/points/new");
  await page.waitForLoadState("networkidle");
  const form = page.getByRole("form", { name: "Lube point" });
  await form.getByLabel("Asset").selectOption({ index: 1 });
  await form.getByLabel("Point name").fill("Test fan side");
  await form.getByLabel("Bore d (mm)").fill("50");
  await form.getByLabel("Outside diameter D (mm)").fill("40");
  await form.getByLabel("Width B (mm)").fill("27");
  await form.getByLabel("Speed (r/min)").fill("1480");
  await form.getByLabel("Operating temperature (°C)").fill("60");
  await form.getByLabel("Running hours per day").fill("24");
  await form.getByLabel("Assigned grease").selectOption({ label: "Brackenridge Aurum EM2 (GL-EM2)" });
  await form.getByRole("button", { name: "Add the point" }).click();
  await expect(form.getByText("The outside diameter D must be larger than the bore d.")).toBeVisible();
  await snap(page, "point-form-error");

  await form.getByLabel("Outside diameter D (mm)").fill("110");
  await form.getByRole("button", { name: "Add the point" }).click();
  await expect(page.getByRole("heading", { name: "Test fan side" })).toBeVisible();
  await expect(page.getByText(/Interval [\d,]+ h \(calculated\)/)).toBeVisible();
  await expect(page.getByText("Replenishment quantity: 14.85 g")).toBeVisible();
});

test("a technician who prefers imperial units sees inches and °F", async ({ page }) => {
  await signIn(page, "tech@example.com");
  await page.goto("/account");
  await page.getByLabel("Imperial (in, oz, °F)").check();
  await page.getByRole("button", { name: "Save" }).click();
  await expect(page.getByText("Units saved.")).toBeVisible();
  const list = (await (await page.request.get("/api/v1/points")).json()) as { items: { tag: string }[] };
  await page.goto(`/points/${list.items[0]!.tag}`);
  await expect(page.getByText(/ in × /)).toBeVisible();
  await expect(page.getByText(/°F/).first()).toBeVisible();
  await page.goto("/account");
  await page.getByLabel("Metric (mm, g, °C)").check();
  await page.getByRole("button", { name: "Save" }).click();
  await expect(page.getByText("Units saved.")).toBeVisible();
});

test("the lead imports lube points from CSV: bad cells are marked, good rows create the area, asset and points", async ({ page }) => {
  const stamp = Date.now().toString(36).toUpperCase();
  const header =
    "site_code,area_code,area_name,asset_tag,asset_name,asset_kind,point_name,bearing_type,bearing_designation,bore_mm,outside_diameter_mm,width_mm,speed_rpm,operating_temperature_c,running_hours_per_day,vertical_shaft,contamination,moisture,vibration,food_grade_required,replenishment,sealed_for_life,grease_code,maker_interval_hours,maker_quantity_grams";
  const csv = [
    header,
    `KBC,IMP${stamp.slice(-4)},Imported area,IMP-${stamp},Imported pump,pump,drive end,ball,6309,45,100,25,2950,55,24,no,low,moderate,low,no,side,no,GL-LX2,,`,
    `KBC,IMP${stamp.slice(-4)},Imported area,IMP-${stamp},Imported pump,pump,free end,ball,6307,35,80,21,2950,55,24,no,low,moderate,low,no,side,no,GL-LX2,3000,8`,
    `MFW,X,Bad,IMP-BAD,Bad,pump,bad row,roller,,45,40,25,2950,,30,no,low,low,low,no,side,no,NOPE,,`,
  ].join("\n");
  await signIn(page, "lead@example.com");
  await page.goto("/points/import");
  await page.waitForLoadState("networkidle");
  await page.getByLabel("CSV file").setInputFiles({ name: "points.csv", mimeType: "text/csv", buffer: Buffer.from(csv) });
  const bad = page.getByTestId("import-line-4");
  await expect(bad).toContainText("✖ skipped");
  await expect(bad).toContainText("No grease with this code in the catalogue.");
  await expect(bad).toContainText("Choose the bearing type.");
  await snap(page, "points-import-preview");
  await page.getByRole("button", { name: "Import 2 row(s)" }).click();
  await expect(page.getByText("2 lube point(s) were added")).toBeVisible();
  await page.goto("/points");
  await page.getByLabel("Find a point, asset or tag").fill(`IMP-${stamp}`);
  await expect(page.locator("tbody tr")).toHaveCount(2);
});
