import { expect, test } from "@playwright/test";
import zlib from "node:zlib";
import { screenshot, seriousViolations, signIn } from "./fixtures";

// The shop's records in the browser: an assembly with a photo (the progress bar shows while it goes),
// two runs (one a failure) in the table and on the evidence chart, and the printed torque checklist.

const FOUR = "Fenwick-Oddy 2.0 four";

/** A valid PNG of about 3 MB of noise (stored, not deflated), so the upload takes a moment. */
function noisyPng(width = 1000, height = 1000): Buffer {
  const crcTable = Array.from({ length: 256 }, (_, n) => {
    let c = n;
    for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
    return c >>> 0;
  });
  const crc = (b: Buffer) => {
    let c = 0xffffffff;
    for (const x of b) c = crcTable[(c ^ x) & 0xff]! ^ (c >>> 8);
    return (c ^ 0xffffffff) >>> 0;
  };
  const chunk = (type: string, data: Buffer) => {
    const len = Buffer.alloc(4);
    len.writeUInt32BE(data.length);
    const td = Buffer.concat([Buffer.from(type), data]);
    const c = Buffer.alloc(4);
    c.writeUInt32BE(crc(td));
    return Buffer.concat([len, td, c]);
  };
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(width, 0);
  ihdr.writeUInt32BE(height, 4);
  ihdr.set([8, 2, 0, 0, 0], 8);
  const raw = Buffer.alloc((width * 3 + 1) * height);
  let seed = 7;
  for (let i = 0; i < raw.length; i++) raw[i] = i % (width * 3 + 1) === 0 ? 0 : (seed = (seed * 1103515245 + 12345) >>> 0) >>> 24;
  return Buffer.concat([
    Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
    chunk("IHDR", ihdr),
    chunk("IDAT", zlib.deflateSync(raw, { level: 0 })),
    chunk("IEND", Buffer.alloc(0)),
  ]);
}

test("a builder records an assembly with a photo, logs two runs and sees them in the table and on the evidence chart", async ({
  page,
  context,
}) => {
  test.setTimeout(120_000);
  await signIn(page, "builder@example.com");
  await page.goto("/engines");
  await page.getByRole("link", { name: FOUR }).click();
  await page.waitForURL(/\/engines\/\d+$/);
  const engineUrl = page.url().replace(/\/$/, "");
  await page.getByRole("navigation", { name: "Engine" }).getByRole("link", { name: "Assembly" }).click();
  await expect(page.getByRole("heading", { name: "Assembly", exact: true })).toBeVisible();

  const form = page.getByRole("form", { name: "Record an assembly" });
  await form.getByLabel("Assembled by").fill("Teo Vastrick");
  await form.getByLabel("Date").fill("2026-11-29");
  await form.getByLabel("Protrusion measured (mm)").fill("0.09");
  await form.getByLabel("A4", { exact: true }).fill("0.361");
  await form.getByRole("button", { name: "Record the assembly" }).click();
  await expect(page.getByRole("status").first()).toHaveText("✔ Assembly recorded.");
  const recorded = page.getByRole("article", { name: "Assembly of 2026-11-29" });
  await expect(recorded).toContainText("by Teo Vastrick");
  await expect(recorded.getByRole("table")).toContainText("A4");

  // slow the upload so the progress bar can be seen
  const cdp = await context.newCDPSession(page);
  await cdp.send("Network.enable");
  await cdp.send("Network.emulateNetworkConditions", {
    offline: false,
    latency: 20,
    downloadThroughput: -1,
    uploadThroughput: 1024 * 1024,
  });
  await recorded
    .getByLabel("Add a photo of this assembly")
    .setInputFiles({ name: "deck-after-torque.png", mimeType: "image/png", buffer: noisyPng() });
  await recorded.getByRole("button", { name: "Upload" }).click();
  const bar = recorded.getByRole("progressbar", { name: "Upload progress" });
  await expect(bar).toBeVisible();
  await screenshot(page, "records-upload-progress");
  await expect(recorded.getByText("✔ Kept deck-after-torque.png.")).toBeVisible({ timeout: 30_000 });
  await cdp.send("Network.emulateNetworkConditions", { offline: false, latency: 0, downloadThroughput: -1, uploadThroughput: -1 });
  await expect(recorded.getByRole("img", { name: "Photo: deck-after-torque.png" })).toBeVisible();
  // a renamed file is refused with a clear message
  await recorded
    .getByLabel("Add a photo of this assembly")
    .setInputFiles({ name: "photo.jpg", mimeType: "image/jpeg", buffer: Buffer.from("MZ this is not a photo at all, it is a program") });
  await recorded.getByRole("button", { name: "Upload" }).click();
  await expect(recorded.getByRole("alert")).toContainText("Only photos (JPEG, PNG, WebP) and PDFs");
  await screenshot(page, "records-assembly");

  // two runs, one a failure
  await page.goto(`${engineUrl}/runs`);
  for (const run of [
    { date: "2026-11-30", kpa: "300", peak: "135", outcome: "Held", cyl: "" },
    { date: "2026-12-01", kpa: "360", peak: "175", outcome: "Combustion leak", cyl: "2, 3" },
  ]) {
    await page.getByLabel("Date", { exact: true }).fill(run.date);
    await page.getByLabel("Manifold pressure (kPa abs)").fill(run.kpa);
    await page.getByLabel("Peak cylinder pressure, measured (bar)").fill(run.peak);
    await page.getByLabel("Outcome", { exact: true }).selectOption({ label: run.outcome });
    await page.getByLabel("Cylinders affected").fill(run.cyl);
    await page.getByRole("button", { name: "Log the run" }).click();
    await expect(page.getByRole("status").first()).toHaveText("✔ Run logged.");
  }
  const table = page.getByRole("table", { name: "The engine's runs" });
  await expect(table.getByRole("row")).toHaveCount(3);
  await expect(table).toContainText("Combustion leak");
  await expect(table).toContainText("2, 3");
  // filter to the failures, then sort by peak pressure
  await page.getByLabel("Show outcome").selectOption({ label: "Anything but held" });
  await page.getByRole("button", { name: "Filter" }).click();
  await expect(table.getByRole("row")).toHaveCount(2);
  await screenshot(page, "records-runs");

  await page.goto("/evidence");
  await expect(page.getByRole("heading", { name: "Evidence" })).toBeVisible();
  await expect(page.getByRole("status").filter({ hasText: "runs plotted" })).toContainText("10 runs plotted");
  await expect(page.getByRole("img", { name: /predicted seal margin at its logged peak pressure/ })).toBeVisible();
  await expect(page.getByRole("table")).toContainText("Combustion leak at");
  await screenshot(page, "records-evidence");
});

test("the torque procedure checklist prints with its sequence drawing and a box per stud per stage", async ({ page }) => {
  await signIn(page, "viewer@example.com");
  await page.goto("/engines");
  await page.getByRole("link", { name: FOUR }).click();
  await page.getByRole("navigation", { name: "Engine" }).getByRole("link", { name: "Assembly" }).click();
  await page.getByRole("link", { name: "Copper + wire at the maker's 125 lbf·ft" }).click();
  await expect(page.getByRole("heading", { name: /^Torque procedure/ })).toBeVisible();
  await expect(page.getByRole("img", { name: /^Tightening sequence: 1\. A4, 2\. B4/ })).toBeVisible();
  await page.emulateMedia({ media: "print" });
  await expect(page.getByRole("navigation", { name: "Engine" })).toBeHidden();
  // 14 studs × 3 stages
  await expect(page.getByLabel("box to tick")).toHaveCount(42);
  await screenshot(page, "records-checklist-print");
});

test("a builder records a machining sheet and reads the plan's estimate planned against measured", async ({ page }) => {
  await signIn(page, "builder@example.com");
  await page.goto("/engines");
  await page.getByRole("link", { name: FOUR }).click();
  await page.getByRole("navigation", { name: "Engine" }).getByRole("link", { name: "Machining" }).click();
  await expect(page.getByRole("heading", { name: "Machining and measurement", exact: true })).toBeVisible();
  // the demo's sheet: bore 1's sleeve under the deck reads thin where the plan holds
  const demo = page.getByRole("article", { name: "Machining record of 2026-11-20" });
  await expect(demo.getByText("As planned")).toBeVisible();
  await expect(demo.getByText(/^✔ Holds: combustion seal/)).toBeVisible();
  await expect(demo.getByText(/^⚠ Thin: combustion seal.*cylinder 1/)).toBeVisible();

  const form = page.getByRole("form", { name: "Record machining and measurements" });
  await form.getByLabel("Date").fill("2026-11-27");
  await form.getByLabel("Head flatness (mm)").fill("0.02");
  await form.getByLabel("Gasket compressed thickness (mm)").fill("1.08");
  for (const [bore, mm] of [
    ["Bore 1", "0.10"],
    ["Bore 2", "0.11"],
    ["Bore 3", "-0.05"],
    ["Bore 4", "0.10"],
  ])
    await form.getByLabel(bore, { exact: true }).fill(mm);
  await form.getByRole("button", { name: "Keep the record" }).click();
  await expect(page.getByRole("status").first()).toHaveText("✔ Machining record kept.");
  const sheet = page.getByRole("article", { name: "Machining record of 2026-11-27" });
  const table = sheet.getByRole("table", { name: "Seal margin planned and measured, per cylinder" });
  await expect(table.getByRole("row")).toHaveCount(5);
  await expect(table.getByRole("row").nth(3)).toContainText("-0.050 mm");
  await expect(sheet.getByText("recorded only: the model takes the faces as flat")).toBeVisible();
  await expect(sheet.getByText(/^⚠ Thin: combustion seal.*cylinder 3/)).toBeVisible();
  expect(await seriousViolations(page)).toEqual([]);
  await screenshot(page, "records-machining");
});
