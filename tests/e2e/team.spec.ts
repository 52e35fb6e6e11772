import { expect, test, type Browser, type Page } from "@playwright/test";
import { screenshot, seriousViolations, signIn, signOut } from "./fixtures";
import { linkIn, waitForMail } from "./mail";

// Issue 12 end to end on the built app: the invite and the reset travel as real SMTP mail to the
// local sink (started by the Playwright config), and the test follows the links it caught.

const CUSTOMER = "customer-e2e@example.com";
const CUSTOMER_PASSWORD = "my engine, my sheet";

async function asNewPerson<T>(browser: Browser, work: (page: Page) => Promise<T>): Promise<T> {
  const context = await browser.newContext();
  try {
    return await work(await context.newPage());
  } finally {
    await context.close();
  }
}

test("the owner invites a customer, a builder shares one engine, the customer reads exactly that engine's build sheet", async ({
  page,
  browser,
}) => {
  test.setTimeout(120_000);
  await signIn(page, "owner@example.com");
  await page.goto("/team");
  const since = new Date().toISOString();
  await page.getByLabel("E-mail").fill(CUSTOMER);
  await page.getByLabel("Role", { exact: true }).selectOption("viewer");
  await page.getByRole("button", { name: "Send the invite" }).click();
  await expect(page.getByRole("status")).toContainText(`Invite sent to ${CUSTOMER}`);
  await expect(page.getByRole("list", { name: "Invites not yet accepted" })).toContainText(CUSTOMER);
  await screenshot(page, "team-invite-sent");
  const mail = await waitForMail(CUSTOMER, since);
  expect(mail.subject).toContain("invites you to Harrow Lane Boost Works");
  const invitePath = linkIn(mail, "/invite/");

  // the customer, in a browser of their own, accepts and makes the account
  await asNewPerson(browser, async (customer) => {
    await customer.goto(invitePath);
    await expect(customer.getByRole("heading", { name: "Join Harrow Lane Boost Works" })).toBeVisible();
    await customer.getByLabel("Your name").fill("Cass Tomerly");
    await customer.getByLabel("Password").fill(CUSTOMER_PASSWORD);
    await customer.getByRole("button", { name: "Create my account and join" }).click();
    await customer.waitForURL(/\/dashboard$/);
    await signOut(customer);
    // the link works once
    await customer.goto(invitePath);
    await expect(customer.getByText("This invite link has been used already.")).toBeVisible();
  });

  // a builder shares the four-cylinder with the new viewer
  await signOut(page);
  await signIn(page, "builder@example.com");
  await page.goto("/engines");
  await page.getByRole("link", { name: "Fenwick-Oddy 2.0 four", exact: true }).click();
  await page.getByRole("navigation", { name: "Engine" }).getByRole("link", { name: "Sharing" }).click();
  await page.getByRole("button", { name: "Share with Cass Tomerly" }).click();
  await expect(page.getByRole("status")).toContainText("Shared");
  await expect(page.getByRole("button", { name: "Stop sharing with Cass Tomerly" })).toBeVisible();

  // the customer signs in and sees that engine and nothing else
  await asNewPerson(browser, async (customer) => {
    await signIn(customer, CUSTOMER, CUSTOMER_PASSWORD);
    await customer.goto("/engines");
    const rows = customer.getByRole("table").getByRole("row");
    await expect(rows).toHaveCount(2); // the header and one engine
    await expect(rows.nth(1)).toContainText("Fenwick-Oddy 2.0 four");
    await rows.nth(1).getByRole("link").first().click();
    await customer.waitForURL(/\/engines\/\d+$/);
    const engineUrl = customer.url();
    await customer.getByRole("navigation", { name: "Engine" }).getByRole("link", { name: "Build sheet" }).click();
    await expect(customer.getByTestId("build-sheet")).toBeVisible();
    await expect(customer.getByTestId("sheet-verdict")).toContainText(/Holds|Thin|Short/);
    await expect(customer.getByTestId("sheet-cylinders").getByRole("row")).toHaveCount(5);
    await expect(customer.getByRole("heading", { name: "E-mail it to the customer" })).toHaveCount(0);
    await expect(customer.getByRole("navigation", { name: "Engine" }).getByRole("link", { name: "Sharing" })).toHaveCount(0);
    expect(await seriousViolations(customer)).toEqual([]);
    await screenshot(customer, "build-sheet-viewer");
    // the other engines are not found, even by address
    const six = Number(new URL(engineUrl).pathname.split("/").pop()) + 1;
    expect((await customer.goto(`/engines/${six}/build-sheet`))?.status()).toBe(404);
  });
});

test("the build sheet prints clean on A4 and US Letter", async ({ page }) => {
  await signIn(page, "builder@example.com");
  await page.goto("/engines");
  await page.getByRole("link", { name: "Fenwick-Oddy 2.0 four", exact: true }).click();
  await page.getByRole("navigation", { name: "Engine" }).getByRole("link", { name: "Build sheet" }).click();
  await expect(page.getByTestId("build-sheet")).toBeVisible();
  // A4's printable width at 96 px/in: 210 mm less the 12 mm side margins
  await page.setViewportSize({ width: Math.floor(((210 - 24) / 25.4) * 96), height: 1000 });
  await page.emulateMedia({ media: "print" });
  await expect(page.getByRole("banner")).toBeHidden();
  await expect(page.getByRole("navigation", { name: "Engine" })).toBeHidden();
  await expect(page.getByRole("button", { name: "Print" })).toBeHidden();
  await expect(page.getByRole("heading", { name: "E-mail it to the customer" })).toBeHidden();
  await expect(page.getByRole("note", { name: "Caution" })).toBeVisible();
  expect(await page.evaluate(() => document.documentElement.scrollWidth <= window.innerWidth + 1)).toBe(true);
  await screenshot(page, "build-sheet-print");
  for (const format of ["A4", "Letter"] as const) {
    const pdf = await page.pdf({ format, printBackground: false });
    const pages = (pdf.toString("latin1").match(/\/Type\s*\/Page[^s]/g) ?? []).length;
    expect(pages, `${format} pages`).toBeGreaterThanOrEqual(1);
    expect(pages, `${format} pages`).toBeLessThanOrEqual(3);
  }
});

test("a forgotten password is reset through the mail, and the old one stops working", async ({ page }) => {
  const email = "reset-e2e@example.com";
  await page.goto("/signup");
  await page.getByLabel("Your name").fill("Rory Feldane");
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Shop or team name").fill("Reset Test Garage (demo)");
  await page.getByLabel("Password").fill("the first long sentence");
  await page.getByRole("button", { name: /create/i }).click();
  await page.waitForURL(/\/dashboard$/);
  await signOut(page);

  await page.getByRole("link", { name: "Forgot your password?" }).click();
  await expect(page.getByRole("heading", { name: "Reset your password" })).toBeVisible();
  const since = new Date().toISOString();
  await page.getByLabel("E-mail").fill(email);
  await page.getByRole("button", { name: "Send the link" }).click();
  await expect(page.getByRole("status")).toContainText("If that address has a Sealwright account");
  const mail = await waitForMail(email, since);
  const resetPath = linkIn(mail, "/reset-password/");
  await page.goto(resetPath);
  await page.getByLabel("New password", { exact: true }).fill("the second long sentence");
  await page.getByLabel("New password again").fill("the second long sentence");
  await page.getByRole("button", { name: "Set the password" }).click();
  await page.waitForURL(/\/login$/);
  await expect(page.getByRole("status")).toContainText("Password changed");
  await expect(page.getByRole("heading", { name: "Sign in" })).toBeVisible();

  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill("the first long sentence");
  await page.getByRole("button", { name: "Sign in" }).click();
  await expect(page.getByText("Wrong e-mail or password.")).toBeVisible();
  await signIn(page, email, "the second long sentence");
  // used once, the link is dead
  await page.goto(resetPath);
  await expect(page.getByText("This link has been used or has expired.")).toBeVisible();
});

test("the development mailbox is absent from the production build", async ({ page }) => {
  expect((await page.goto("/dev/mailbox"))?.status()).toBe(404);
});
