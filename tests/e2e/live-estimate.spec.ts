import { expect, test } from "@playwright/test";
import { signIn } from "./fixtures";

// Issue 14, the browser side: what the plan editor and the evidence page put off so a keystroke and
// a first visit stay quick, and that what they put off still reads right.

const FOUR = "Fenwick-Oddy 2.0 four";

test("the editor's figures follow a keystroke; the charts redraw once the figures settle and are in view", async ({ page }) => {
  await signIn(page, "builder@example.com");
  await page.goto("/engines");
  await page.getByRole("link", { name: FOUR }).click();
  await page.getByRole("navigation", { name: "Engine" }).getByRole("link", { name: "Seal plans" }).click();
  await page
    .getByRole("table")
    .getByRole("link", { name: /Copper \+ wire, 150 lbf·ft/ })
    .click();
  await page.waitForLoadState("networkidle");
  const margin = page.getByTestId("weakest-margin");
  const before = await margin.textContent();
  const cylinders = await page.getByTestId("cylinders").textContent();
  await page.getByLabel(/Final torque/).fill("90");
  await expect(margin).not.toHaveText(before ?? "");
  // the deferred table follows too, and once the sweep is back nothing is marked as on its way
  await expect(page.getByTestId("cylinders")).not.toHaveText(cylinders ?? "");
  await expect(page.getByTestId("recalculating")).toHaveCount(0, { timeout: 10_000 });
  await expect(page.locator('section[aria-labelledby="estimate-title"]')).toHaveAttribute("aria-busy", "false");
  const charts = page.getByTestId("charts");
  await charts.scrollIntoViewIfNeeded();
  await expect(charts).toHaveAttribute("data-behind", "false");
  await expect(charts.locator("canvas")).toHaveCount(2);
  await expect(page.getByRole("img", { name: /^Chart: seal-line load left under firing per cylinder/ })).toBeVisible();
});

test("the evidence chart loads into a frame that keeps its size, named from the first paint; the runs read as a table", async ({
  page,
}) => {
  await signIn(page, "builder@example.com");
  const chartCode: string[] = [];
  page.on("request", (r) => {
    if (/\/assets\/evidence-chart-.*\.js$/.test(r.url())) chartCode.push(r.url());
  });
  await page.goto("/evidence");
  const frame = page.getByRole("img", { name: /predicted seal margin at its logged peak pressure/ });
  await expect(frame).toBeVisible();
  const first = await frame.boundingBox();
  await frame.scrollIntoViewIfNeeded();
  await expect(frame.locator("canvas")).toHaveCount(1);
  expect(chartCode.length).toBe(1);
  const after = await frame.boundingBox();
  expect(after?.height).toBeCloseTo(first?.height ?? 0, 0);
  const plotted = Number((await page.getByRole("status").filter({ hasText: "plotted" }).textContent())?.match(/(\d+) runs? plotted/)?.[1]);
  expect(plotted).toBeGreaterThan(0);
  await page.getByText(/The plotted runs as a table/).click();
  const runs = page.getByRole("table", { name: /Each plotted run/ });
  await expect(runs.getByRole("row")).toHaveCount(plotted + 1);
  await expect(runs).toContainText(/\d\.\d\d/);
  const cls = await page.evaluate(
    () =>
      new Promise<number>((resolve) => {
        let sum = 0;
        new PerformanceObserver((l) => {
          for (const e of l.getEntries() as (PerformanceEntry & { value: number; hadRecentInput: boolean })[])
            if (!e.hadRecentInput) sum += e.value;
        }).observe({ type: "layout-shift", buffered: true });
        setTimeout(() => resolve(sum), 300);
      }),
  );
  expect(cls).toBeLessThanOrEqual(0.05);
});
