import { expect, test } from "@playwright/test";
import { screenshot, seriousViolations, signIn } from "./fixtures";

test("the builder adds a fastener with the maker's figures, sees it listed, and archives it", async ({ page }) => {
  await signIn(page, "builder@example.com");
  await page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Libraries" }).click();
  await expect(page).toHaveURL(/\/libraries\/fasteners$/);
  await expect(page.getByRole("heading", { name: /Fasteners/ })).toBeVisible();
  // seeded rows name their source
  await expect(page.getByRole("cell", { name: /demo data \(invented\)/ }).first()).toBeVisible();
  await expect(page.getByRole("note", { name: "Caution" })).toBeVisible();

  await page.getByRole("link", { name: "New fastener" }).click();
  await expect(page.getByRole("group", { name: "From the fastener maker's sheet" })).toBeVisible();
  await expect(page.getByText("Keep the maker's sheet itself below the form, once the fastener is saved.")).toBeVisible();
  await page.getByLabel("Name").fill("E2E M11×1.5 head stud");
  await page.getByLabel(/^Maker's recommended torque/).fill("118");
  await page.getByLabel("Maker's lubricant").fill("Moly assembly paste");
  await page.getByLabel("Maker's stages").fill("40, 80, then 118 N·m");
  await page.getByLabel("Thread system").selectOption("metric");
  await page.getByLabel("Stud material").selectOption({ label: "Alloy steel stud, ISO 898-1 class 12.9" });
  await page.getByLabel(/^Thread diameter/).fill("11");
  await page.getByLabel(/^Pitch/).fill("1.5");
  await page.getByLabel(/^Free thread in the grip/).fill("15");
  await page.getByLabel(/^Thread engagement/).fill("22");
  await page.getByLabel(/^Washer outer diameter/).fill("20");
  await page.getByLabel(/^Washer hole/).fill("11.5");
  await page.getByLabel(/^Washer thickness/).fill("3");
  expect(await seriousViolations(page)).toEqual([]);
  await screenshot(page, "library-fastener-form");
  await page.getByRole("button", { name: "Add fastener" }).click();

  await expect(page).toHaveURL(/\/libraries\/fasteners$/);
  await expect(page.getByRole("status")).toContainText("Added “E2E M11×1.5 head stud”");
  const row = page.getByRole("row", { name: /E2E M11×1\.5 head stud/ });
  await expect(row).toContainText("118 N·m");
  await expect(row).toContainText("Moly assembly paste");
  await expect(row).toContainText("entered by Teo Vastrick");
  await screenshot(page, "library-fasteners");

  await row.getByRole("link", { name: "E2E M11×1.5 head stud" }).click();
  // the maker's sheet, kept with the row
  const sheets = page.getByRole("region", { name: /The fastener maker's sheets/ });
  await expect(sheets).toContainText("No sheets kept yet.");
  await sheets.getByLabel("Add the maker's sheet (PDF) or a photo of it").setInputFiles({
    name: "stud maker sheet.pdf",
    mimeType: "application/pdf",
    buffer: Buffer.from("%PDF-1.4\n1 0 obj\n<< /Type /Catalog >>\nendobj\ntrailer\n<< /Root 1 0 R >>\n%%EOF\n"),
  });
  await sheets.getByRole("button", { name: "Upload" }).click();
  await expect(sheets.getByText("✔ Kept stud maker sheet.pdf.")).toBeVisible();
  await expect(sheets.getByRole("link", { name: /stud maker sheet\.pdf/ })).toHaveAttribute("href", /^\/files\/\d+$/);
  await expect(page.getByRole("heading", { name: "The fastener maker's sheets (1)" })).toBeVisible();
  expect(await seriousViolations(page)).toEqual([]);
  await screenshot(page, "library-fastener-sheet");
  await sheets.getByRole("button", { name: "Take away stud maker sheet.pdf" }).click();
  await expect(page.getByRole("status").first()).toContainText("Took away stud maker sheet.pdf.");
  await expect(page.getByRole("heading", { name: "The fastener maker's sheets (0)" })).toBeVisible();
  await page.getByRole("button", { name: "Archive" }).click();
  await expect(page.getByRole("status")).toContainText("Archived");
  await expect(page.getByRole("row", { name: /E2E M11×1\.5 head stud/ })).toHaveCount(0);
  await page.getByRole("button", { name: /Show archived/ }).click();
  await expect(page.getByRole("row", { name: /E2E M11×1\.5 head stud/ })).toContainText("Archived");
});

test("the viewer reads the libraries but has no edit controls", async ({ page }) => {
  await signIn(page, "viewer@example.com");
  await page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Libraries" }).click();
  await expect(page.getByRole("heading", { name: /Fasteners/, level: 2 })).toBeVisible();
  await expect(page.getByRole("link", { name: "New fastener" })).toHaveCount(0);
  await page.getByRole("table").getByRole("link").first().click();
  await expect(page.getByText("You can read the shop's library; builders and owners change it.")).toBeVisible();
  await expect(page.getByRole("button", { name: "Save" })).toHaveCount(0);
  await expect(page.getByLabel("Name", { exact: true })).toBeDisabled();
  await expect(page.getByRole("note", { name: "Caution" })).toBeVisible();
  const response = await page.goto("/libraries/gaskets/new");
  expect(response?.status()).toBe(403);
  await expect(page.getByRole("heading", { name: "Not allowed" })).toBeVisible();
});
