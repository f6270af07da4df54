import { expect, test } from "@playwright/test";
import { signIn, signOut, snap } from "./helpers";

type Mail = { id: number; to: string[]; subject: string; text: string };

async function waitForMail(to: string): Promise<Mail> {
  const inbox = process.env.MAIL_FAKE_URL!;
  const deadline = Date.now() + 20_000;
  for (;;) {
    const messages = (await (await fetch(`${inbox}/messages`)).json()) as Mail[];
    const found = messages.find((m) => m.to.includes(to));
    if (found) return found;
    if (Date.now() > deadline) throw new Error(`no mail to ${to} arrived`);
    await new Promise((r) => setTimeout(r, 250));
  }
}

test("an admin invites a person, the mail arrives, the link sets a password, the person signs in", async ({ page }) => {
  const email = `new.clerk.${Date.now()}@example.com`;
  await signIn(page, "admin@example.com");
  await page.getByRole("link", { name: "Users", exact: true }).click();
  await expect(page.getByRole("heading", { name: "Users" })).toBeVisible();
  await snap(page, "admin-users");

  const form = page.getByRole("form", { name: "Invite a person" });
  await form.getByRole("button", { name: "Send invitation" }).click();
  await expect(form.getByText("Enter the person's name.")).toBeVisible();
  await expect(form.getByText("Enter an e-mail address.")).toBeVisible();

  await form.getByLabel("Name").fill("Mirela Quennell");
  await form.getByLabel("E-mail address").fill(email);
  await form.getByLabel("Role").selectOption("clerk");
  await form.getByLabel("Kestrel Bay Cement Works").check();
  await form.getByRole("button", { name: "Send invitation" }).click();
  await expect(form.getByText("Invitation sent.")).toBeVisible();
  await expect(page.getByTestId(`user-row-${email}`)).toContainText("Invited");

  const mail = await waitForMail(email);
  expect(mail.subject).toBe("You are invited to Greaseledger");
  const link = mail.text.match(/https?:\/\/\S+\/invite\/[A-Za-z0-9_-]+/)?.[0];
  expect(link).toBeTruthy();

  await page.goto(process.env.MAIL_FAKE_URL!);
  await snap(page, "mail-inbox");

  await page.goto("/admin/outbox");
  await expect(page.getByRole("cell", { name: "You are invited to Greaseledger" }).first()).toBeVisible();
  await snap(page, "admin-outbox");
  await signOut(page);

  await page.goto(link!);
  await expect(page.getByRole("heading", { name: "Set your password" })).toBeVisible();
  await page.getByLabel("New password").fill("short");
  await page.getByLabel("The same password again").fill("short");
  await page.getByRole("button", { name: "Set password" }).click();
  await expect(page.getByText(/at least 12 characters/i).first()).toBeVisible();
  await page.getByLabel("New password").fill("cartridge shelf seven");
  await page.getByLabel("The same password again").fill("cartridge shelf seven");
  await snap(page, "invite-set-password");
  await page.getByRole("button", { name: "Set password" }).click();
  await expect(page.getByText("Your password is set.")).toBeVisible();

  await signIn(page, email, "cartridge shelf seven");
  await expect(page.getByTestId("signed-in-role")).toHaveText("Storeroom clerk");
  await expect(page.getByText("Kestrel Bay Cement Works")).toBeVisible();

  // The link works once.
  await page.goto(link!);
  await expect(page.getByText("This invitation link has already been used.")).toBeVisible();
});

test("disabling a user ends their session at once", async ({ browser }) => {
  const admin = await browser.newPage();
  const victim = await browser.newPage({ storageState: undefined });
  const email = `leaver.${Date.now()}@example.com`;

  // Invite and activate a person through the pages.
  await signIn(admin, "admin@example.com");
  await admin.goto("/admin/users");
  const form = admin.getByRole("form", { name: "Invite a person" });
  await form.getByLabel("Name").fill("Oskar Trevanion");
  await form.getByLabel("E-mail address").fill(email);
  await form.getByLabel("Role").selectOption("technician");
  await form.getByRole("button", { name: "Send invitation" }).click();
  await expect(form.getByText("Invitation sent.")).toBeVisible();
  const mail = await waitForMail(email);
  const link = mail.text.match(/https?:\/\/\S+\/invite\/[A-Za-z0-9_-]+/)![0];
  await victim.goto(link);
  await victim.getByLabel("New password").fill("grease gun holster");
  await victim.getByLabel("The same password again").fill("grease gun holster");
  await victim.getByRole("button", { name: "Set password" }).click();
  await expect(victim.getByText("Your password is set.")).toBeVisible();
  await signIn(victim, email, "grease gun holster");

  await admin.reload();
  const row = admin.getByTestId(`user-row-${email}`);
  await row.getByRole("button", { name: "Disable Oskar Trevanion" }).click();
  await expect(row).toContainText("Disabled");

  await victim.goto("/overview");
  await expect(victim).toHaveURL(/\/sign-in$/);
  await admin.close();
  await victim.close();
});
