import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser } from "playwright-core";
import path from "node:path";
import { APP_URL } from "../support/app";
import { ARTIFACTS, launchBrowser } from "../support/browser";
import { signedInPage } from "../support/browser-session";

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

describe("a planner plans a wave in the browser", () => {
  it("imports the demo order sheet, plans a wave with progress, and opens a batch with its route drawn", async () => {
    const { context, page } = await signedInPage(browser, "planner", { width: 1400, height: 1000 });
    await page.goto(`${APP_URL}/orders`);
    await page
      .getByLabel("Spreadsheet (.xlsx or .csv)")
      .setInputFiles(path.resolve(process.cwd(), "public/demo/bramblegate-orders-2026-11-28.csv"));
    const importButton = page.getByRole("button", { name: /^Import \d+ rows$/ });
    await importButton.waitFor();
    await expect(importButton.textContent()).resolves.toBe("Import 117 rows");
    await page.screenshot({ path: path.join(ARTIFACTS, "orders-import-preview.png"), fullPage: true });
    await importButton.click();
    await page.getByText("Imported 40 orders with 117 order lines.").waitFor();

    await page.goto(`${APP_URL}/waves`);
    await page.getByLabel("Name").fill(`Saturday early ${Date.now()}`);
    await page.getByLabel("Cut-off up to (optional)").fill("2026-11-28T10:00");
    await page.getByLabel("Totes per cart (one order per tote)").fill("5");
    await page.getByRole("button", { name: "Create the wave" }).click();
    await page.waitForURL(/\/waves\/\d+$/);
    await page.getByRole("button", { name: "Plan the wave" }).click();
    await page.getByText(/Planned \d+ batches/).waitFor({ timeout: 60_000 });
    await page.getByRole("heading", { name: "Batches" }).waitFor();
    await page.getByRole("link", { name: "#1", exact: true }).waitFor();
    await page.screenshot({ path: path.join(ARTIFACTS, "wave-planned.png"), fullPage: true });
    const firstRowTotes = await page.getByRole("row").nth(1).getByRole("cell").nth(3).textContent();
    expect(Number(firstRowTotes)).toBeLessThanOrEqual(5);

    await page.getByRole("link", { name: "#1", exact: true }).click();
    await page.waitForURL(/\/batches\/1$/);
    const map = page.getByRole("img", { name: /Route of this batch/ });
    await map.waitFor();
    // Numbered stops on the map match the stop list.
    const stops = await page
      .getByRole("list", { name: "Stops in walking order" })
      .getByText(/^Stop \d+$/)
      .count();
    expect(stops).toBeGreaterThan(0);
    expect(await map.locator("polyline").count()).toBeGreaterThan(0);
    await page.screenshot({ path: path.join(ARTIFACTS, "batch-route.png"), fullPage: true });
    await context.close();
  });
});
