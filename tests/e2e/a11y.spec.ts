import { expect, test, type Page } from "@playwright/test";
import { seriousViolations, signIn, signOut } from "./fixtures";

// Issue 16 kept fixed: what a keyboard, screen-reader, zoomed or printing builder meets. (Axe on every
// page the crawl reaches, as each role, runs in crawl.spec.ts; the error states are scanned here.)

const FOUR = "Fenwick-Oddy 2.0 four";
// The skip link, then the engine's nine tabs and the plan fields above the torque: 25 presses today.
// A new tab or field above the torque must be a choice, so the bound is today's count.
const MAX_TABS_TO_TORQUE = 25;

async function openFirstPlan(page: Page): Promise<string> {
  await page.goto("/engines");
  await page.getByRole("link", { name: FOUR }).click();
  await page.getByRole("navigation", { name: "Engine" }).getByRole("link", { name: "Seal plans" }).click();
  await page.getByRole("table").getByRole("link").first().click();
  await expect(page.getByRole("heading", { name: "Estimate" })).toBeVisible();
  return page.url();
}

const announced = (page: Page) => page.getByTestId("verdict-announcement");

test("from the top of the plan editor the keyboard reaches the torque in a bounded number of Tabs, and the new verdict is announced once", async ({
  page,
}) => {
  test.setTimeout(60_000);
  await signIn(page, "builder@example.com");
  const planUrl = await openFirstPlan(page);
  await page.goto(planUrl);
  await page.waitForLoadState("networkidle");
  // first stop: the skip link, which jumps past the header
  await page.keyboard.press("Tab");
  await expect(page.getByRole("link", { name: "Skip to the page" })).toBeFocused();
  await page.keyboard.press("Enter");
  let presses = 1;
  while (presses < MAX_TABS_TO_TORQUE) {
    await page.keyboard.press("Tab");
    presses += 1;
    if (await page.evaluate(() => document.activeElement?.id === "f-torque")) break;
  }
  await expect(page.locator("#f-torque")).toBeFocused();
  test.info().annotations.push({ type: "tabs-to-torque", description: String(presses) });
  console.log(`Tab presses from the page top to the torque field: ${presses}`);
  // nothing is said on arrival; a torque far too low is, once the figures settle
  await expect(announced(page)).toHaveText("");
  await page.keyboard.press("ControlOrMeta+a");
  await page.keyboard.type("20");
  await page.keyboard.press("Tab");
  await expect(page.locator("#f-stages")).toBeFocused();
  await page.keyboard.press("ControlOrMeta+a");
  await page.keyboard.type("10, 20");
  await expect(announced(page)).toHaveText(/^Estimate updated\. Verdict: (Short|Thin)/, { timeout: 10_000 });
  await expect(page.getByTestId("verdict")).toContainText(
    (await announced(page).textContent())!.replace("Estimate updated. Verdict: ", ""),
  );
  // the panel keeps full contrast while it works: no fading
  expect(await page.locator('section[aria-labelledby="estimate-title"]').evaluate((s) => getComputedStyle(s).opacity)).toBe("1");
  // Enter in a plan field recalculates: the page stays, nothing is saved
  await page.keyboard.press("Enter");
  await expect(page.locator("#estimate-title")).toBeFocused();
  await expect(page.getByText("Plan saved.")).toHaveCount(0);
  await page.goto(planUrl);
  await expect(page.locator("#f-torque")).not.toHaveValue("20");
});

test("a refused save leaves focus on the announced error summary, with the form still filled in", async ({ page }) => {
  test.setTimeout(60_000);
  await signIn(page, "builder@example.com");
  await openFirstPlan(page);
  await page.getByLabel("Plan name").fill("");
  await page.getByLabel(/Final torque/).fill("140");
  await page.getByRole("button", { name: "Save plan" }).click();
  const summary = page.getByTestId("error-summary");
  await expect(summary).toBeFocused();
  await expect(summary).toHaveAttribute("role", "alert");
  await expect(summary).toContainText("Plan name: Name the plan");
  // the form was not rebuilt: what was typed is still there
  await expect(page.getByLabel(/Final torque/)).toHaveValue("140");
  expect(await seriousViolations(page)).toEqual([]);
  // the summary's link takes the builder to the field
  await summary.getByRole("link").first().click();
  await expect(page.getByLabel("Plan name")).toBeFocused();
});

test("every form answers a refusal with a focused error summary, and the error pages have titles and pass axe", async ({ page }) => {
  test.setTimeout(150_000);
  // sign-up, empty
  await page.goto("/signup");
  await page.getByRole("button", { name: "Create shop" }).click();
  await expect(page.getByTestId("error-summary")).toBeFocused();
  await expect(page.getByTestId("error-summary")).toContainText("Your name: Enter your name");
  expect(await seriousViolations(page)).toEqual([]);
  // sign-in, wrong password
  await page.goto("/login");
  await page.getByLabel("E-mail").fill("builder@example.com");
  await page.getByLabel("Password").fill("not the password at all");
  await page.getByRole("button", { name: "Sign in" }).click();
  await expect(page.getByTestId("error-summary")).toBeFocused();
  expect(await seriousViolations(page)).toEqual([]);

  await signIn(page, "builder@example.com");
  // new engine, empty
  await page.goto("/engines/new");
  await page.getByRole("button", { name: "Save engine" }).first().click();
  await expect(page.getByTestId("error-summary")).toBeFocused();
  await expect(page.getByTestId("error-summary")).toContainText("The engine was not saved");
  expect(await seriousViolations(page)).toEqual([]);
  // new plan, nameless
  await page.goto("/engines");
  await page.getByRole("link", { name: FOUR }).click();
  await page.waitForURL(/\/engines\/\d+$/);
  const engineUrl = page.url();
  await page.goto(`${engineUrl}/plans/new`);
  await page.getByLabel("Plan name").fill("");
  await page.getByRole("button", { name: "Create plan" }).click();
  await expect(page.getByTestId("error-summary")).toBeFocused();
  expect(await seriousViolations(page)).toEqual([]);
  // chamber what-if, unreadable
  await page.goto(`${engineUrl}/chamber?thickness=thick`);
  await expect(page.getByTestId("error-summary")).toBeFocused();
  expect(await seriousViolations(page)).toEqual([]);
  // library fastener, empty
  await page.goto("/libraries/fasteners/new");
  await page.getByLabel("Name", { exact: true }).fill("");
  await page.getByRole("button", { name: /^Add / }).click();
  await expect(page.getByTestId("error-summary")).toBeFocused();
  expect(await seriousViolations(page)).toEqual([]);

  // 404 inside the engine page, the unknown address, and a viewer's 403
  for (const [url, status] of [
    ["/engines/999999", 404],
    ["/no-such-page", 404],
  ] as const) {
    const response = await page.goto(url);
    expect(response?.status()).toBe(status);
    expect(await page.title()).toMatch(/ · Sealwright$/);
    expect(await seriousViolations(page)).toEqual([]);
  }
  await page.goto("/dashboard");
  await signOut(page);
  await signIn(page, "viewer@example.com");
  const response = await page.goto(`${engineUrl}/edit`);
  expect(response?.status()).toBe(403);
  expect(await page.title()).toBe("Not open to your role · Sealwright");
  expect(await seriousViolations(page)).toEqual([]);
});

test("Escape closes the phone menu and hands focus back to its button", async ({ page }) => {
  await page.setViewportSize({ width: 390, height: 844 });
  await signIn(page, "builder@example.com");
  await page.getByRole("button", { name: "☰ Menu" }).click();
  const nav = page.getByRole("navigation", { name: "Main" });
  await expect(nav).toBeVisible();
  await nav.getByRole("link").first().focus();
  await page.keyboard.press("Escape");
  await expect(nav).toBeHidden();
  await expect(page.getByRole("button", { name: "☰ Menu" })).toBeFocused();
});

test("at 320 px (400 % zoom) the plan editor, chamber and new-engine pages reflow without sideways scrolling", async ({ page }) => {
  await page.setViewportSize({ width: 320, height: 640 });
  await signIn(page, "builder@example.com");
  const planUrl = await openFirstPlan(page);
  const engineUrl = planUrl.replace(/\/plans\/\d+$/, "");
  for (const url of [planUrl, `${engineUrl}/chamber`, "/engines/new"]) {
    await page.goto(url);
    await page.waitForLoadState("networkidle");
    const widths = await page.evaluate(() => ({
      scroll: document.documentElement.scrollWidth,
      viewport: window.innerWidth,
      // what sticks out, to say which box needs to reflow
      wide: Array.from(document.querySelectorAll("main *"))
        .filter((el) => el.getBoundingClientRect().right > window.innerWidth + 1 && !el.closest(".overflow-x-auto, .sr-only"))
        .slice(0, 5)
        .map((el) => `${el.tagName.toLowerCase()}.${String(el.className).slice(0, 50)}`),
    }));
    expect(widths.scroll, `${url}: ${widths.wide.join(" | ")}`).toBeLessThanOrEqual(widths.viewport + 1);
  }
});

test("without JavaScript, picking wet sleeves shows the sleeve fields at once", async ({ browser, baseURL }) => {
  const context = await browser.newContext({ javaScriptEnabled: false, baseURL });
  const page = await context.newPage();
  await page.goto("/login");
  await page.getByLabel("E-mail").fill("builder@example.com");
  await page.getByLabel("Password").fill("sealwright-demo");
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL((url) => !url.pathname.startsWith("/login"));
  await page.goto("/engines/new");
  await expect(page.getByLabel("Sleeve material")).toBeHidden();
  await page.getByLabel("Sleeves", { exact: true }).selectOption({ label: "Wet sleeves, mid support" });
  await expect(page.getByLabel("Sleeve material")).toBeVisible();
  await expect(page.getByLabel(/Sleeve wall at the top/)).toBeVisible();
  await expect(page.getByLabel(/Support length, top to seat/)).toBeVisible();
  await context.close();
});

test("a printed plan is a sheet of at most two A4 pages: inputs as a table, no buttons, charts and caution kept", async ({ page }) => {
  await signIn(page, "builder@example.com");
  await openFirstPlan(page);
  await page.waitForLoadState("networkidle");
  await expect(page.locator("figure canvas")).toHaveCount(2);
  await page.emulateMedia({ media: "print" });
  await expect(page.locator("button:visible")).toHaveCount(0);
  await expect(page.locator("input:visible, select:visible, textarea:visible")).toHaveCount(0);
  await expect(page.getByTestId("plan-print-sheet")).toBeVisible();
  await expect(page.getByTestId("plan-print-sheet")).toContainText("Final torque");
  await expect(page.getByRole("note", { name: "Caution" })).toBeVisible();
  await expect(page.locator("figure canvas:visible")).toHaveCount(2);
  const pdf = await page.pdf({ format: "A4", printBackground: true });
  // each page of the document is one "/Type /Page" object (the tree's root is "/Type /Pages")
  const pages = (pdf.toString("latin1").match(/\/Type\s*\/Page(?![s\w])/g) ?? []).length;
  console.log(`Printed pages for the plan: ${pages}`);
  expect(pages).toBeGreaterThanOrEqual(1);
  expect(pages).toBeLessThanOrEqual(2);
});
