import { expect, test, type Page } from "@playwright/test";
import AxeBuilder from "@axe-core/playwright";
import { screenshot, signIn } from "./fixtures";

// A link crawler over the demo shop: as each role, start at the dashboard and follow every link
// (<a href>) and every GET form (submitted with the values it shows) within the app, breadth-first.
// It fails on any page that answers 404 or 5xx, on any link that answers 403 (a role must not be
// shown a link it may not follow), and, at a phone's 390 px, on any page wider than the screen.
// Axe scans the first page of each kind (ids and queries folded: /engines/:id/plans/:id) as each role
// and fails on serious or critical violations; every impact is counted for the audit figures.

const PHONE = { width: 390, height: 844 };
const MAX_PAGES = 300;
// Sort and filter links multiply one list into dozens of addresses; a few of each keep the crawl broad.
const MAX_VARIANTS_PER_PATH = 12;

interface Visit {
  url: string;
  from: string;
}

interface Finding {
  url: string;
  from: string;
  problem: string;
}

/** Same-origin GET targets on the page: links, and GET forms as a builder would submit them untouched. */
async function targets(page: Page): Promise<string[]> {
  return page.evaluate(() => {
    const out: string[] = [];
    for (const a of Array.from(document.querySelectorAll<HTMLAnchorElement>("a[href]"))) {
      if (a.hasAttribute("download")) continue;
      // kept files (photos, PDFs) are resources, not pages: tests/integration/uploads.test.ts covers them
      if (new URL(a.href).pathname.startsWith("/files/")) continue;
      out.push(a.href);
    }
    for (const form of Array.from(document.querySelectorAll<HTMLFormElement>("form"))) {
      if ((form.getAttribute("method") ?? "get").toLowerCase() !== "get") continue;
      const url = new URL(form.action, location.href);
      url.search = "";
      for (const [k, v] of new FormData(form)) if (typeof v === "string") url.searchParams.append(k, v);
      out.push(url.href);
    }
    return out;
  });
}

function key(url: URL): string {
  return url.pathname + url.search;
}

/** A page's kind: its path with the ids folded, so axe scans one engine, one plan, one list of each. */
function pageKind(url: URL): string {
  return url.pathname.replace(/\/\d+(?=\/|$)/g, "/:id");
}

const IMPACTS = ["critical", "serious", "moderate", "minor"] as const;

async function crawl(page: Page, origin: string) {
  const scanned = new Set<string>();
  const impacts: Record<string, number> = { critical: 0, serious: 0, moderate: 0, minor: 0 };
  const seen = new Set<string>();
  const perPath = new Map<string, number>();
  const queue: Visit[] = [{ url: `${origin}/dashboard`, from: "(start)" }];
  seen.add("/dashboard");
  const findings: Finding[] = [];
  const visited: string[] = [];
  while (queue.length > 0 && visited.length < MAX_PAGES) {
    const { url, from } = queue.shift()!;
    const response = await page.goto(url, { waitUntil: "load" });
    const status = response?.status() ?? 0;
    visited.push(url);
    if (status === 404 || status >= 500) {
      findings.push({ url, from, problem: `answers ${status}` });
      continue;
    }
    if (status === 403) {
      const kind = await page.getByRole("heading", { name: "Not open to your role" }).count();
      findings.push({ url, from, problem: `is linked but answers 403${kind ? "" : " (and not kindly)"}` });
      continue;
    }
    // the caution once per page: in full beside the figures, or in the footer, never both
    const cautions = await page.getByText("Estimates, not instructions.").count();
    if (cautions !== 1) findings.push({ url, from, problem: `shows the caution ${cautions} times` });
    const widths = await page.evaluate(() => ({ scroll: document.documentElement.scrollWidth, viewport: window.innerWidth }));
    if (widths.scroll > widths.viewport + 1)
      findings.push({ url, from, problem: `is ${widths.scroll} px wide on a ${widths.viewport} px phone` });
    const here = new URL(page.url());
    if (here.pathname.startsWith("/login")) {
      findings.push({ url, from, problem: "sent the signed-in person back to sign-in" });
      continue;
    }
    if (!scanned.has(pageKind(here))) {
      scanned.add(pageKind(here));
      const { violations } = await new AxeBuilder({ page }).analyze();
      for (const v of violations) {
        impacts[v.impact ?? "minor"] = (impacts[v.impact ?? "minor"] ?? 0) + v.nodes.length;
        if (v.impact === "serious" || v.impact === "critical")
          findings.push({ url, from, problem: `axe ${v.impact}: ${v.id} (${v.nodes.map((n) => n.target.join(" ")).join(", ")})` });
      }
    }
    for (const href of await targets(page)) {
      const next = new URL(href);
      if (next.origin !== origin) continue;
      if (next.pathname === "/logout" || next.pathname.startsWith("/api/")) continue;
      next.hash = "";
      const k = key(next);
      if (seen.has(k)) continue;
      const variants = perPath.get(next.pathname) ?? 0;
      if (next.search && variants >= MAX_VARIANTS_PER_PATH) continue;
      seen.add(k);
      perPath.set(next.pathname, variants + 1);
      queue.push({ url: next.href, from: url });
    }
  }
  return { findings, visited, scanned: scanned.size, impacts: IMPACTS.map((i) => `${i} ${impacts[i]}`).join(", ") };
}

for (const [role, email] of [
  ["owner", "owner@example.com"],
  ["builder", "builder@example.com"],
  ["viewer", "viewer@example.com"],
] as const) {
  test(`as the ${role}, every page reachable from the dashboard answers, offers no refused link, fits a phone and passes axe`, async ({
    page,
    baseURL,
  }) => {
    // the crawl plus an axe scan of each kind of page: about two minutes a role on a quiet machine
    test.setTimeout(15 * 60_000);
    await page.setViewportSize(PHONE);
    await signIn(page, email);
    const { findings, visited, scanned, impacts } = await crawl(page, new URL(baseURL!).origin);
    console.log(`${role}: ${visited.length} pages, ${scanned} kinds scanned by axe; violation nodes by impact: ${impacts}`);
    const report = findings.map((f) => `${f.url} ${f.problem} (linked from ${f.from})`);
    expect(report, `${visited.length} pages visited`).toEqual([]);
    // the crawl really went somewhere: the engines, their plans and the libraries
    expect(visited.some((u) => /\/engines\/\d+\/plans\/\d+$/.test(u))).toBe(true);
    expect(visited.some((u) => /\/libraries\/fasteners\/\d+$/.test(u))).toBe(true);
    expect(visited.some((u) => /\/engines\/\d+\/compare\?/.test(u))).toBe(true);
    expect(visited.some((u) => /\/engines\/\d+\/build-sheet$/.test(u))).toBe(true);
    expect(visited.some((u) => /\/engines\/\d+\/machining$/.test(u))).toBe(true);
    // sharing is a builder's; the demo viewer is shown the one engine shared with them
    expect(visited.some((u) => /\/engines\/\d+\/sharing$/.test(u))).toBe(role !== "viewer");
    if (role === "viewer") expect(new Set(visited.flatMap((u) => u.match(/\/engines\/(\d+)/)?.[1] ?? [])).size).toBe(1);
    expect(visited.length).toBeGreaterThan(role === "viewer" ? 15 : 30);
  });
}

test("a viewer who types a builder's address reads a kind refusal inside the engine page", async ({ page }) => {
  await signIn(page, "viewer@example.com");
  await page.goto("/engines");
  await page.getByRole("row").nth(1).getByRole("link").first().click();
  await page.waitForURL(/\/engines\/\d+$/);
  const engineUrl = page.url();
  await page.goto(`${engineUrl}/plans`);
  const planPath = new URL(
    await page
      .getByRole("table")
      .getByRole("link")
      .first()
      .evaluate((a) => (a as HTMLAnchorElement).href),
  ).pathname;
  const planId = planPath.split("/").pop();
  for (const path of ["/edit", "/plans/new", `/plans/${planId}/copy`]) {
    const response = await page.goto(engineUrl + path);
    expect(response?.status()).toBe(403);
    await expect(page.getByRole("heading", { name: "Not open to your role" })).toBeVisible();
    await expect(page.getByRole("navigation", { name: "Engine" })).toBeVisible();
  }
});

test("a four-plan compare and the new-engine form fit a phone", async ({ page }) => {
  await page.setViewportSize(PHONE);
  await signIn(page, "builder@example.com");
  await page.goto("/engines");
  await page.getByRole("link", { name: "Fenwick-Oddy 2.0 four", exact: true }).click();
  await page.waitForURL(/\/engines\/\d+$/);
  const engineUrl = page.url();
  await page.goto(`${engineUrl}/plans`);
  const plans = await page.getByRole("table").getByRole("checkbox").count();
  for (let i = plans; i < 4; i++) {
    await page.goto(`${engineUrl}/plans/new`);
    await page.getByLabel("Plan name").fill(`Phone compare plan ${i + 1}`);
    await page.getByRole("button", { name: "Create plan" }).click();
    await expect(page.getByRole("status")).toHaveText("✔ Plan created.");
  }
  await page.goto(`${engineUrl}/plans`);
  await expect(page.getByRole("table").getByRole("checkbox", { checked: true })).toHaveCount(4);
  await page.getByRole("button", { name: "Compare ticked plans" }).click();
  await expect(page.getByRole("heading", { name: "Compare plans" })).toBeVisible();
  await expect(page.getByRole("table").getByRole("columnheader")).toHaveCount(5);
  const fits = () => page.evaluate(() => document.documentElement.scrollWidth <= window.innerWidth + 1);
  expect(await fits()).toBe(true);
  // whatever the table's width, it stays inside its own box (which scrolls sideways when it must)
  const box = await page
    .getByRole("table")
    .evaluate((t) => ({ right: t.parentElement!.getBoundingClientRect().right, overflow: getComputedStyle(t.parentElement!).overflowX }));
  expect(box.right).toBeLessThanOrEqual(PHONE.width);
  expect(box.overflow).toBe("auto");
  await screenshot(page, "phone-compare-four");
  await page.goto("/engines/new");
  expect(await fits()).toBe(true);
  await screenshot(page, "phone-new-engine");
});
