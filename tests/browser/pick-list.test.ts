import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser } from "playwright-core";
import path from "node:path";
import { APP_URL } from "../support/app";
import { ARTIFACTS, launchBrowser } from "../support/browser";
import { signedInPage } from "../support/browser-session";
import { decodeBarcodePng } from "../support/decode-barcode";
import { getBatch } from "@/db/batches";
import { closeDb } from "@/db/knex";
import { batchLabel } from "@/lib/print/batch-label";

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await closeDb();
});

describe("printed pick list", () => {
  it("lists every stop in route order, with a barcode that reads back as the batch, and says reprint the second time", async () => {
    // Wave 2 is the seeded Tuesday morning wave, planned and not released.
    const { context, page } = await signedInPage(browser, "planner", { width: 1000, height: 1400 });
    await page.goto(`${APP_URL}/waves/2/batches/1/print`);
    const batch = (await getBatch(2, 1))!;
    const expected = batch.stops.flatMap((s) => s.lines.map((l) => `${s.seq} ${l.binCode}`));
    const rows = page.getByTestId("pick-line");
    await rows.first().waitFor();
    const shown = await rows.evaluateAll((trs) =>
      trs.map((tr) => `${tr.children[0]?.textContent} ${tr.children[1]?.textContent?.replace(" ▲", "")}`),
    );
    expect(shown).toEqual(expected);

    const barcode = await page
      .getByTestId("batch-barcode")
      .screenshot({ path: path.join(ARTIFACTS, "pick-list-barcode.png") });
    expect(decodeBarcodePng(barcode)).toBe(batchLabel(2, 1));
    await page.screenshot({ path: path.join(ARTIFACTS, "pick-list.png"), fullPage: true });
    await page.emulateMedia({ media: "print" });
    await page.screenshot({ path: path.join(ARTIFACTS, "pick-list-print.png"), fullPage: true });
    await page.emulateMedia({ media: "screen" });

    await expect(page.getByText(/Reprint/).count()).resolves.toBe(0);
    await page.evaluate(() => {
      window.print = () => {};
    });
    const recorded = page.waitForResponse((r) => r.url().endsWith("/api/waves/2/printed") && r.status() === 200);
    await page.getByRole("button", { name: "Print this pick list" }).click();
    await recorded;
    await page.reload();
    await page.getByText(/Reprint \(2\. print\)/).waitFor();
    await context.close();
  });
});
