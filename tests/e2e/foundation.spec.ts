import { expect, test } from "@playwright/test";
import { screenshot, seriousViolations, signIn, signOut } from "./fixtures";

const NAV: Record<string, string[]> = {
  "owner@example.com": ["Dashboard", "Engines", "Libraries", "Evidence", "Team", "Settings"],
  "builder@example.com": ["Dashboard", "Engines", "Libraries", "Evidence", "Settings"],
  "viewer@example.com": ["Dashboard", "Engines", "Libraries", "Settings"],
};

for (const [email, items] of Object.entries(NAV)) {
  test(`${email} signs in, sees the right navigation and signs out`, async ({ page }) => {
    await signIn(page, email);
    await expect(page).toHaveURL(/\/dashboard$/);
    await expect(page.getByRole("heading", { level: 1 })).toHaveText("Harrow Lane Boost Works");
    const links = page.getByRole("navigation", { name: "Main" }).getByRole("link");
    await expect(links).toHaveText(items);
    await signOut(page);
    await page.goto("/dashboard");
    await expect(page).toHaveURL(/\/login\?redirectTo=%2Fdashboard$/);
  });
}

test("a wrong password shows one message and keeps the e-mail", async ({ page }) => {
  await page.goto("/login");
  await page.getByLabel("E-mail").fill("builder@example.com");
  await page.getByLabel("Password").fill("not-the-password");
  await page.getByRole("button", { name: "Sign in" }).click();
  await expect(page.getByRole("alert")).toHaveText("✖ Wrong e-mail or password.");
  await expect(page.getByLabel("E-mail")).toHaveValue("builder@example.com");
});

test("a signed-out visitor is sent to sign-in and back to the page asked for", async ({ page }) => {
  await page.goto("/settings");
  await expect(page).toHaveURL(/\/login\?redirectTo=%2Fsettings$/);
  await page.getByLabel("E-mail").fill("viewer@example.com");
  await page.getByLabel("Password").fill("sealwright-demo");
  await page.getByRole("button", { name: "Sign in" }).click();
  await expect(page).toHaveURL(/\/settings$/);
  await expect(page.getByRole("heading", { name: "Settings" })).toBeVisible();
});

test("a new shop signs up, bad input first", async ({ page }) => {
  await page.goto("/signup");
  await page.getByLabel("Your name").fill("Nell Ashgrove");
  await page.getByLabel("E-mail").fill("nell@ashgrove.example");
  await page.getByLabel("Shop or team name").fill("Ashgrove Engine Room");
  await page.getByLabel("Password").fill("short");
  await page.getByRole("button", { name: "Create shop" }).click();
  // the message beside the field, and in the summary that takes focus
  await expect(page.locator("#f-password-error")).toContainText("Use at least 8 characters");
  await expect(page.getByTestId("error-summary")).toBeFocused();
  await expect(page.getByTestId("error-summary")).toContainText("Password: Use at least 8 characters");
  await expect(page.getByLabel("Shop or team name")).toHaveValue("Ashgrove Engine Room");
  await page.getByLabel("Password").fill("a long shop password");
  await page.getByRole("button", { name: "Create shop" }).click();
  await expect(page).toHaveURL(/\/dashboard$/);
  await expect(page.getByRole("heading", { level: 1 })).toHaveText("Ashgrove Engine Room");
  await expect(page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Team" })).toBeVisible();
});

test("a viewer is refused the owner's team page", async ({ page }) => {
  await signIn(page, "viewer@example.com");
  const response = await page.goto("/team");
  expect(response?.status()).toBe(403);
  await expect(page.getByRole("heading", { name: "Not allowed" })).toBeVisible();
});

test("the dashboard works on a phone-sized screen", async ({ page }) => {
  await page.setViewportSize({ width: 390, height: 800 });
  await signIn(page, "builder@example.com");
  await page.getByRole("button", { name: "☰ Menu" }).click();
  await expect(page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Engines" })).toBeVisible();
  await screenshot(page, "dashboard-phone");
});

test("sign-in page and dashboard pass an axe scan; screenshots saved", async ({ page }) => {
  await page.goto("/login");
  expect(await seriousViolations(page)).toEqual([]);
  await screenshot(page, "sign-in");
  await signIn(page, "owner@example.com");
  expect(await seriousViolations(page)).toEqual([]);
  await screenshot(page, "dashboard");
});
