import { expect, test, type Page } from "@playwright/test";
import { screenshot, seriousViolations, signIn } from "./fixtures";

const FOUR = "Fenwick-Oddy 2.0 four";
const M12 = "M12×1.5 head stud, reduced shank";
const SEVEN = "7/16-20 chromoly head stud, full shank";
const SIX = "Number 47 crew straight six";

async function engineUrl(page: Page, name: string) {
  await page.goto("/engines");
  await page.getByRole("link", { name, exact: true }).click();
  await page.waitForURL(/\/engines\/\d+$/);
  return page.url();
}

test("a new fastener brings its maker's torque, stages, lubricant and friction; the builder may override, and another lubricant is flagged", async ({
  page,
}) => {
  await signIn(page, "builder@example.com");
  const four = await engineUrl(page, FOUR);
  await page.goto(`${four}/plans/new`);
  await page.getByLabel("Plan name").fill("M12 at the maker's figures");
  await page.getByLabel("Fastener", { exact: true }).selectOption({ label: M12 });
  await expect(page.getByTestId("figures-followed")).toHaveText(
    `↻ Torque, stages and lubricant now follow the maker's figures for ${M12}; change them if you mean to.`,
  );
  await expect(page.getByLabel("Final torque (N·m)")).toHaveValue("150");
  await expect(page.getByLabel("Stages (N·m)")).toHaveValue("40, 90, 150");
  await expect(page.getByLabel("Lubricant", { exact: true })).toHaveValue("Moly assembly paste");
  await expect(page.getByLabel("Thread friction")).toHaveValue("0.11");
  await expect(page.getByLabel("Washer-face friction")).toHaveValue("0.12");
  await expect(page.getByTestId("maker-figure")).toContainText("This plan uses the maker's torque.");
  await expect(page.getByTestId("lubricant-warning")).toHaveCount(0);

  // the builder's own figures stand; a lubricant other than the maker's is said out loud
  await page.getByLabel("Lubricant", { exact: true }).fill("Engine oil");
  await expect(page.getByTestId("lubricant-warning")).toContainText(
    "This plan's lubricant (“Engine oil”) is not the maker's (“Moly assembly paste”)",
  );
  await page.getByLabel("Thread friction").fill("0,15");
  await page.getByLabel("Final torque (N·m)").fill("140");
  await page.getByLabel("Stages (N·m)").fill("60, 100, 140");
  await screenshot(page, "plan-fastener-followed");
  expect(await seriousViolations(page)).toEqual([]);
  await page.getByRole("button", { name: "Create plan" }).click();
  await expect(page.getByRole("status").first()).toHaveText("✔ Plan created.");
  await expect(page.getByLabel("Final torque (N·m)")).toHaveValue("140");
  await expect(page.getByLabel("Thread friction")).toHaveValue("0.15");
  await expect(page.getByLabel("Lubricant", { exact: true })).toHaveValue("Engine oil");
  await expect(page.getByTestId("lubricant-warning")).toBeVisible();

  // in the editor too, live: back to the seven-sixteenths stud and its maker's 35, 65, then 85 lbf·ft
  await page.getByLabel("Fastener", { exact: true }).selectOption({ label: SEVEN });
  await expect(page.getByLabel("Final torque (N·m)")).toHaveValue("115");
  await expect(page.getByLabel("Stages (N·m)")).toHaveValue("47, 88, 115");
  await expect(page.getByTestId("lubricant-warning")).toHaveCount(0);
  await expect(page.getByTestId("maker-figure")).toContainText("115 N·m", { timeout: 10_000 });
});

test("without JavaScript, a changed fastener comes back with its maker's figures before the plan is made", async ({ browser }) => {
  const context = await browser.newContext({ javaScriptEnabled: false });
  const page = await context.newPage();
  await signIn(page, "builder@example.com");
  const four = await engineUrl(page, FOUR);
  await page.goto(`${four}/plans/new`);
  await page.getByLabel("Plan name").fill("Seven-sixteenths, no script");
  await page.getByLabel("Fastener", { exact: true }).selectOption({ label: SEVEN });
  await page.getByRole("button", { name: "Create plan" }).click();
  await expect(page.getByTestId("figures-followed")).toContainText(`follow the maker's figures for ${SEVEN}`);
  await expect(page.getByLabel("Final torque (N·m)")).toHaveValue("115");
  await expect(page.getByLabel("Stages (N·m)")).toHaveValue("47, 88, 115");
  await expect(page.getByLabel("Plan name")).toHaveValue("Seven-sixteenths, no script");
  await page.getByRole("button", { name: "Create plan" }).click();
  await expect(page.getByRole("heading", { name: "Seven-sixteenths, no script" })).toBeVisible();
  await expect(page.getByLabel("Final torque (N·m)")).toHaveValue("115");
  await context.close();
});

test("gaskets are offered by the engine's bore, the others behind “Show all gaskets”", async ({ page }) => {
  await signIn(page, "builder@example.com");
  const four = await engineUrl(page, FOUR);
  await page.goto(`${four}/plans/new`);
  const options = page.getByLabel("Gasket", { exact: true }).locator("option");
  await expect(options).not.toHaveCount(0);
  for (const text of await options.allTextContents()) expect(text).toMatch(/87 mm bore/);
  await page.getByRole("button", { name: /Show all gaskets \(2 more\)/ }).click();
  await expect(page).toHaveURL(/\/plans\/new$/);
  await expect(page.getByLabel("Gasket", { exact: true }).locator("optgroup")).toHaveAttribute("label", "Not for a 86.00 mm bore");
  await expect(options.filter({ hasText: "(does not fit this bore)" })).toHaveCount(2);
});

test("a plan by stretch gauge: the target stretch sets the clamp, and the page says what torque that takes", async ({ page }) => {
  await signIn(page, "builder@example.com");
  const four = await engineUrl(page, FOUR);
  await page.goto(`${four}/plans/new`);
  await page.getByLabel("Plan name").fill("By stretch");
  const stretch = page.getByLabel("Target stretch (mm)");
  // the new plan starts from the four's chosen plan (by stretch gauge): its stud maker's stretch figure is the target
  await expect(stretch).toBeVisible();
  const hint = await page.locator("#f-targetStretch-hint").textContent();
  const maker = /The maker's figure for this stud: ([\d.]+) mm\./.exec(hint ?? "")?.[1];
  expect(maker, hint ?? "").toBeTruthy();
  await expect(stretch).toHaveValue(String(Number(maker)));
  await page.getByLabel("How the studs are tightened").selectOption({ label: "Torque wrench" });
  await expect(stretch).toBeHidden();
  await page.getByLabel("How the studs are tightened").selectOption({ label: "Stretch gauge" });
  await expect(stretch).toBeVisible();
  await expect(page.getByText("Tighten until a stretch gauge on the stud reads the target stretch")).toBeVisible();
  await stretch.fill("0,3");
  await page.getByRole("button", { name: "Create plan" }).click();
  await expect(page.getByRole("heading", { name: "By stretch" })).toBeVisible();
  await expect(stretch).toHaveValue("0.3");
  await expect(page.getByTestId("stretch-line")).toContainText(
    /By the estimate, a stretch of 0\.300 mm is [\d.]+ kN of preload per stud, about \d+ N·m with this friction\./,
  );
  // live: a larger stretch means more preload before anything is saved
  const preload = page.getByTestId("preload");
  const before = await preload.textContent();
  await stretch.fill("0.35");
  await expect(preload).not.toHaveText(before ?? "");
  await expect(page.getByTestId("stretch-line")).toContainText("a stretch of 0.350 mm");
  await screenshot(page, "plan-by-stretch");
  // by torque again: the page says the stretch the torque gives
  await page.getByLabel("How the studs are tightened").selectOption({ label: "Torque wrench" });
  await page.getByRole("button", { name: "Save plan" }).click();
  await expect(page.getByTestId("stretch-line")).toContainText(/By the estimate, \d+ N·m stretches each stud about [\d.]+ mm/);
});

test("duplicate an engine and copy a plan to another engine; a plan whose gasket does not fit is refused in words", async ({ page }) => {
  await signIn(page, "builder@example.com");
  await engineUrl(page, SIX);
  await page.getByRole("button", { name: "Duplicate engine" }).click();
  await expect(page.getByRole("heading", { name: `${SIX} (copy)`, level: 1 })).toBeVisible();
  await expect(page.getByRole("status").first()).toContainText("the record and stud pattern, no plans");
  await page.getByRole("navigation", { name: "Engine" }).getByRole("link", { name: "Seal plans" }).click();
  await expect(page.getByText("No plans yet.")).toBeVisible();

  const four = await engineUrl(page, FOUR);
  await page.goto(`${four}/plans`);
  await page.getByRole("table").getByRole("link").first().click();
  await page.getByRole("link", { name: "Copy to another engine" }).click();
  await page.getByLabel(/Saltings 6\.5 V8/).check();
  await page.getByRole("button", { name: "Copy the plan" }).click();
  await expect(page.getByRole("alert")).toContainText(
    "Not copied to “Saltings 6.5 V8”: The gasket's 87.00 mm bore is smaller than the 106.00 mm cylinder bore",
  );
  await page.getByLabel(/Number 47 crew straight six \(copy\)/).check();
  await screenshot(page, "plan-copy");
  await page.getByRole("button", { name: "Copy the plan" }).click();
  await expect(page.getByRole("status").first()).toContainText(`copied from “${FOUR}”`);
  await expect(page.getByRole("heading", { name: `${SIX} (copy)`, level: 1 })).toBeVisible();
});

test("the plan and engine forms speak the trade, not the standard", async ({ page }) => {
  await signIn(page, "builder@example.com");
  const four = await engineUrl(page, FOUR);
  for (const path of ["/plans/new", "/edit"]) {
    await page.goto(four + path);
    const labels = await page.locator("label, legend, option").allTextContents();
    for (const l of labels) expect(l, `${path}: ${l}`).not.toMatch(/μ|REFERENCES|from memory|kPa abs|Bearing friction/);
  }
  await page.goto(`${four}/edit`);
  await expect(page.getByText(/Absolute = what the boost gauge reads plus the atmosphere/)).toBeVisible();
});

test("the plan editor on a phone", async ({ page }) => {
  await page.setViewportSize({ width: 390, height: 844 });
  await signIn(page, "builder@example.com");
  const four = await engineUrl(page, FOUR);
  await page.goto(`${four}/plans`);
  await page.getByRole("table").getByRole("link").first().click();
  await expect(page.getByRole("heading", { name: "Estimate" })).toBeVisible();
  expect(await page.evaluate(() => document.documentElement.scrollWidth <= window.innerWidth + 1)).toBe(true);
  // the verdict stays in sight while the builder types in the torque field, far above the estimate
  const bar = page.getByTestId("verdict-bar");
  await page.getByLabel(/Final torque/).scrollIntoViewIfNeeded();
  await expect(bar).toBeInViewport();
  await expect(bar).toContainText(/Holds|Thin|Short/);
  await screenshot(page, "phone-plan-editor");
});
