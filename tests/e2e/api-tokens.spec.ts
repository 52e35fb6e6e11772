import { expect, test } from "@playwright/test";
import { screenshot, seriousViolations, signIn } from "./fixtures";

// A builder makes a personal API token in Settings, sees it once, uses it from a script (Playwright's
// request client, no cookie), revokes it, and the script is refused at once.
test("create a token in settings, see it once, use it, revoke it", async ({ page, playwright, baseURL }) => {
  await signIn(page, "builder@example.com");
  await page.goto("/settings");
  await page.getByRole("link", { name: "API tokens" }).click();
  await expect(page.getByRole("heading", { name: "API tokens", level: 1 })).toBeVisible();
  // a builder may give a token at most the builder role
  await expect(page.getByLabel("May act as").locator("option")).toHaveText(["viewer (read only)", "builder"]);

  await page.getByLabel("Name").fill("dyno laptop");
  await page.getByLabel("May act as").selectOption("builder");
  await page.getByRole("button", { name: "Create token" }).click();
  const shown = page.getByTestId("new-token");
  await expect(shown).toHaveText(/^swt_[\w-]{43}$/);
  const token = (await shown.textContent())!;
  await expect(page.getByText("This is the only time it is shown")).toBeVisible();
  await expect(page.getByRole("row", { name: /dyno laptop/ })).toContainText("never");
  expect(await seriousViolations(page)).toEqual([]);
  await screenshot(page, "api-token-created");

  const script = await playwright.request.newContext({ baseURL, extraHTTPHeaders: { Authorization: `Bearer ${token}` } });
  const engines = await script.get("/api/v1/engines?limit=2");
  expect(engines.status()).toBe(200);
  expect((await engines.json()).items).toHaveLength(2);

  // shown once: a reload lists the token by its first characters only, now with a last-used time
  await page.goto("/settings/tokens");
  await expect(page.getByTestId("new-token")).toHaveCount(0);
  expect(await page.content()).not.toContain(token);
  const row = page.getByRole("row", { name: /dyno laptop/ });
  await expect(row).toContainText(token.slice(0, 10) + "…");
  await expect(row).not.toContainText("never");

  await row.getByRole("button", { name: "Revoke dyno laptop" }).click();
  await expect(page.getByText("Token revoked; it is refused from now on.")).toBeVisible();
  await expect(page.getByRole("row", { name: /dyno laptop/ })).toHaveCount(0);
  const refused = await script.get("/api/v1/engines");
  expect(refused.status()).toBe(401);
  expect(await refused.json()).toEqual({ error: "This token is unknown or has been revoked." });
  await script.dispose();
});

test("the API page is public and shows curl examples", async ({ page }) => {
  await page.goto("/docs/api");
  await expect(page.getByRole("heading", { name: "JSON API, version 1" })).toBeVisible();
  await expect(page.getByText('curl -H "Authorization: Bearer $SW_TOKEN"').first()).toBeVisible();
  await expect(page.getByText("Estimates, not instructions.")).toHaveCount(1);
  expect(await seriousViolations(page)).toEqual([]);
  await screenshot(page, "api-docs");
  const doc = await page.request.get("/api/v1/openapi.json");
  expect((await doc.json()).openapi).toBe("3.1.0");
});
