import { expect, test } from "@playwright/test";
import { screenshot, seriousViolations, signIn } from "./fixtures";

test("a builder adds an engine through the form: a bad figure first, then a clean save", async ({ page }) => {
  // the stud rows come from round trips to the server (Generate pattern, Conform's list intents), then the
  // new engine's pages are read: more than the default 30 s on a busy two-core machine
  test.setTimeout(60_000);
  await signIn(page, "builder@example.com");
  await page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Engines" }).click();
  await expect(page.getByRole("heading", { name: "Engines", level: 1 })).toBeVisible();
  await page.getByRole("link", { name: "New engine" }).click();
  await expect(page).toHaveURL(/\/engines\/new$/);

  await page.getByLabel("Name", { exact: true }).fill("Bench test V8");
  await page.getByLabel("Customer", { exact: true }).fill("Dyno day crew");
  await page.getByLabel("Cylinders", { exact: true }).fill("8");
  await page.getByLabel("Layout", { exact: true }).selectOption("V");
  await page.getByRole("button", { name: "Generate pattern" }).click();
  await expect(page.getByRole("textbox", { name: "Stud RB5: cylinders served" })).toHaveValue("8");
  await page.getByLabel("Bore (mm)", { exact: true }).fill("-101.6");
  await page.getByLabel("Stroke (mm)", { exact: true }).fill("88.9");
  await page.getByLabel("Head thickness at the stud (mm)", { exact: true }).fill("105");
  await page.getByLabel("Block (deck) material", { exact: true }).selectOption({ index: 1 });
  await page.getByLabel("Head material", { exact: true }).selectOption({ index: 1 });
  await page.getByLabel("Fuel", { exact: true }).fill("Methanol");
  await page.getByLabel("Target manifold pressure, absolute (kPa)", { exact: true }).fill("300");
  // a stud whose shares do not add up shows it at once, in words as well as colour
  const shares = page.getByRole("textbox", { name: "Stud LA2: share of each cylinder" });
  await shares.fill("0.5 0.3");
  await expect(page.getByRole("row").filter({ has: shares })).toContainText("✖ 0.8, needs 1");
  await page.getByRole("button", { name: "Save engine" }).first().click();

  await expect(page.getByRole("alert").first()).toContainText("The engine was not saved");
  const bore = page.getByLabel("Bore (mm)", { exact: true });
  await expect(bore).toHaveAttribute("aria-invalid", "true");
  await expect(page.getByText("✖ Bore must be greater than zero")).toBeVisible();
  // beside the row (and again in the summary above the form)
  await expect(page.getByRole("row", { name: /^LA2/ })).toContainText("Stud shares for stud LA2 add up to 0.8; they must add up to 1");
  await screenshot(page, "engine-form-errors");

  await bore.fill("101.6");
  await page.getByRole("textbox", { name: "Stud LA2: share of each cylinder" }).fill("1/2 1/2");
  await expect(
    page.getByRole("row").filter({ has: page.getByRole("textbox", { name: "Stud LA2: share of each cylinder" }) }),
  ).toContainText("✔ 1 adds up");
  expect(await seriousViolations(page)).toEqual([]);
  await page.getByRole("button", { name: "Save engine" }).first().click();

  await expect(page).toHaveURL(/\/engines\/\d+$/);
  await expect(page.getByRole("status")).toContainText("Engine “Bench test V8” added.");
  await expect(page.getByRole("heading", { name: "Bench test V8", level: 1 })).toBeVisible();
  const tabs = page.getByRole("navigation", { name: "Engine" }).getByRole("link");
  await expect(tabs).toHaveText(["Overview", "Seal plans", "Chamber", "Build sheet", "Sharing", "Assembly", "Machining", "Runs", "Files"]);
  await expect(page.getByText("101.60 mm")).toBeVisible();
  await expect(page.getByText("20 studs: 12 shared by two bores, 8 serving one bore")).toBeVisible();
  await screenshot(page, "engine-overview");

  await page.getByRole("link", { name: "Runs" }).click();
  // a new engine's run log: the page is there and empty, ready for the first session
  await expect(page.getByRole("heading", { name: "Runs", level: 2 })).toBeVisible();
  await expect(page.getByText("Not built yet.")).toHaveCount(0);

  await page.getByRole("link", { name: "← Engines" }).click();
  const row = page.getByRole("row").filter({ hasText: "Bench test V8" });
  await expect(row).toContainText("V8");
  await expect(row).toContainText("101.60 mm");
  await expect(row).toContainText("Quoted");
  // sort by bore, largest first: the new engine's 101.6 mm sits below the demo V8's 106 mm
  await page.getByRole("link", { name: "Bore" }).click();
  await expect(page.getByRole("columnheader", { name: /Bore/ })).toHaveAttribute("aria-sort", "ascending");
  await page.getByRole("link", { name: "Bore" }).click();
  await expect(page.getByRole("columnheader", { name: /Bore/ })).toHaveAttribute("aria-sort", "descending");
  await expect(page.getByRole("row").nth(2)).toContainText("Bench test V8");
  expect(await seriousViolations(page)).toEqual([]);
  await screenshot(page, "engine-table");
});

test("a viewer sees the engine table and pages but no edit controls", async ({ page }) => {
  await signIn(page, "viewer@example.com");
  await page.goto("/engines");
  await expect(page.getByRole("table")).toBeVisible();
  await expect(page.getByRole("row")).not.toHaveCount(1);
  await expect(page.getByRole("link", { name: "New engine" })).toHaveCount(0);
  await page.getByRole("row").nth(1).getByRole("link").first().click();
  await expect(page.getByRole("navigation", { name: "Engine" })).toBeVisible();
  await expect(page.getByRole("heading", { name: "Geometry" })).toBeVisible();
  await expect(page.getByRole("link", { name: /Edit/ })).toHaveCount(0);
  await expect(page.getByRole("button", { name: /Archive/ })).toHaveCount(0);
  // following an edit address by hand is refused in words, inside the engine page
  await page.goto(page.url() + "/edit");
  await expect(page.getByRole("heading", { name: "Not open to your role" })).toBeVisible();
});
