import { expect, test } from "@playwright/test";
import { signIn, signOut, snap } from "./helpers";

const ALL = ["Overview", "Scan a tag", "Lube points", "Grease catalogue", "Stock", "Mixing incidents", "Audit trail", "Users", "Mail outbox"];

const ROLES = [
  { email: "admin@example.com", role: "Administrator", nav: ["Overview", "Lube points", "Grease catalogue", "Stock", "Mixing incidents", "Audit trail", "Users", "Mail outbox"] },
  { email: "lead@example.com", role: "Lubrication lead", nav: ["Overview", "Scan a tag", "Lube points", "Grease catalogue", "Stock", "Mixing incidents"] },
  { email: "clerk@example.com", role: "Storeroom clerk", nav: ["Overview", "Lube points", "Grease catalogue", "Stock"] },
  { email: "tech@example.com", role: "Lubrication technician", nav: ["Overview", "Scan a tag", "Lube points", "Grease catalogue", "Stock"] },
  { email: "auditor@example.com", role: "Auditor", nav: ["Overview", "Lube points", "Grease catalogue", "Stock", "Mixing incidents", "Audit trail"] },
];

for (const r of ROLES) {
  test(`${r.role} signs in through the page and sees its own navigation`, async ({ page }) => {
    await signIn(page, r.email);
    await expect(page.getByTestId("signed-in-role")).toHaveText(r.role);
    const nav = page.getByRole("navigation", { name: "Sections" });
    for (const label of ALL) {
      const link = nav.getByRole("link", { name: label, exact: true });
      if (r.nav.includes(label)) await expect(link).toBeVisible();
      else await expect(link).toHaveCount(0);
    }
    await snap(page, `overview-${r.email.split("@")[0]}`);
    await signOut(page);
  });
}

test("a section outside the role is refused in words", async ({ page }) => {
  await signIn(page, "clerk@example.com");
  await page.goto("/admin/users");
  await expect(page.getByText("Not available to your role")).toBeVisible();
  await expect(page.getByRole("table")).toHaveCount(0);
  await snap(page, "refused-clerk-users");
});

test("a signed-out visitor is sent to sign-in", async ({ page }) => {
  await page.goto("/overview");
  await expect(page).toHaveURL(/\/sign-in$/);
  await expect(page.getByRole("heading", { name: "Sign in" })).toBeVisible();
  await snap(page, "sign-in");
});

test("a wrong password shows a message and no session", async ({ page }) => {
  await page.goto("/sign-in");
  await page.getByLabel("E-mail address").fill("tech@example.com");
  await page.getByLabel("Password").fill("definitely-not-it");
  await page.getByRole("button", { name: "Sign in" }).click();
  await expect(page.getByRole("alert").filter({ hasText: "Not signed in" })).toContainText("The e-mail address or the password is not right.");
  await expect(page).toHaveURL(/\/sign-in$/);
  await snap(page, "sign-in-wrong-password");
});

test("empty fields are explained under each field", async ({ page }) => {
  await page.goto("/sign-in");
  await page.getByRole("button", { name: "Sign in" }).click();
  await expect(page.getByText("Enter an e-mail address.")).toBeVisible();
  await expect(page.getByText("Enter your password.")).toBeVisible();
});

test.describe("on a phone", () => {
  test.use({ viewport: { width: 390, height: 844 } });
  test("the menu folds and opens", async ({ page }) => {
    await signIn(page, "tech@example.com");
    const menu = page.getByRole("button", { name: /Menu/ });
    await expect(menu).toBeVisible();
    await expect(page.getByRole("link", { name: "Scan a tag" })).toBeHidden();
    await snap(page, "phone-overview-technician");
    await menu.click();
    await expect(page.getByRole("link", { name: "Scan a tag" })).toBeVisible();
    await snap(page, "phone-menu-open");
    await page.getByRole("link", { name: "Scan a tag" }).click();
    await expect(page).toHaveURL(/\/scan$/);
    await expect(page.getByRole("heading", { name: "Scan a tag" })).toBeVisible();
  });
});

test("an unknown address shows our not-found page", async ({ page }) => {
  await page.goto("/no-such-page");
  await expect(page.getByRole("heading", { name: "There is nothing at this address" })).toBeVisible();
});
