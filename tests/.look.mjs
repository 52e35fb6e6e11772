import { chromium } from "playwright";
const b = await chromium.launch({ executablePath: "/usr/bin/chromium" });
const base = "http://127.0.0.1:4555";
const pages = ["/dashboard", "/engines", "/engines/1", "/engines/1/plans", "/engines/1/plans/1", "/engines/1/machining", "/engines/1/build-sheet", "/libraries", "/libraries/gaskets", "/evidence", "/engines/1/edit"];
for (const role of ["owner", "builder", "viewer"]) {
  const ctx = await b.newContext({ viewport: { width: 1280, height: 900 } });
  const pg = await ctx.newPage();
  await pg.goto(base + "/login");
  await pg.getByLabel("E-mail").fill(`${role}@example.com`);
  await pg.getByLabel("Password").fill("sealwright-demo");
  await pg.getByRole("button", { name: /sign in/i }).click();
  await pg.waitForURL(/dashboard/);
  const seen = new Set(); const bad = [];
  for (const p of pages) {
    const r = await pg.goto(base + p);
    const caution = await pg.getByText(/Estimates, not instructions|estimate/i).count();
    console.log(role, p, r.status(), "caution-ish:", caution > 0);
    const hrefs = await pg.locator("a[href^='/']").evaluateAll((as) => as.map((a) => a.getAttribute("href")));
    for (const h of hrefs) if (!seen.has(h)) seen.add(h);
    if (role === "builder" && p === "/engines/1/plans/1") await pg.screenshot({ path: "/tmp/ed-top.png" });
  }
  for (const h of seen) { const r = await pg.request.get(base + h, { maxRedirects: 0 }); if (r.status() >= 400) bad.push(`${h} ${r.status()}`); }
  console.log(role, "links followed:", seen.size, "bad:", bad);
  if (role === "builder") {
    await pg.goto(base + "/engines/1/machining");
    await pg.locator("input[name=headFlatnessMm]").fill("3");
    await pg.locator("input[name=measuredOn]").fill("not a date").catch(() => {});
    const before = await pg.locator("text=/Head flatness/").count();
    await pg.getByRole("button", { name: /keep|save|record/i }).first().click();
    await pg.waitForLoadState("networkidle");
    console.log("machining bad input:", (await pg.locator("[role=alert], [id$=-error]").allInnerTexts()).slice(0, 4));
    await pg.screenshot({ path: "/tmp/mach-bad.png", fullPage: false });
  }
  if (role === "viewer") {
    const r = await pg.goto(base + "/engines/1/machining");
    console.log("viewer machining", r.status(), "form?", await pg.locator("input[name=headFlatnessMm]").count());
  }
  await ctx.close();
}
await b.close();
