import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Locator, Page } from "playwright-core";
import path from "node:path";
import { api, APP_URL, signInAs } from "../support/app";
import { ARTIFACTS, launchBrowser } from "../support/browser";
import { signedInPage } from "../support/browser-session";
import { plannedCertificateWave } from "../support/certificate-wave";
import { TestOrders } from "../support/wave-orders";
import { closeDb } from "@/db/knex";
import type { BatchSummaryDTO } from "@/lib/contracts/batches";

// The route's certificate on a 390 px handheld (a supervisor's phone on the floor): in words on the
// wave page, the batch page and the pick list, wrapped inside the screen rather than pushed off it.
const TAG = `RC${Date.now().toString(36).toUpperCase()}`;
const WIDTH = 390;
const fixtures = new TestOrders();
let browser: Browser;
let waveId: number;
let batches: BatchSummaryDTO[];

beforeAll(async () => {
  browser = await launchBrowser();
  const planner = await signInAs("planner");
  waveId = await plannedCertificateWave(fixtures, planner, TAG);
  batches = (await api().get(`/api/waves/${waveId}`).set("Cookie", planner)).body.batches;
});

afterAll(async () => {
  await browser?.close();
  await fixtures.cleanUp();
  await closeDb();
});

async function fitsScreen(page: Page, el: Locator) {
  const box = (await el.boundingBox())!;
  expect(box.x).toBeGreaterThanOrEqual(0);
  expect(box.x + box.width).toBeLessThanOrEqual(WIDTH);
  expect(await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth)).toBeLessThanOrEqual(0);
}

describe("a route's certificate on a handheld", () => {
  it("reads in words on the wave page, the batch page and the pick list at 390 px", async () => {
    const { context, page } = await signedInPage(browser, "supervisor", { width: WIDTH, height: 844 });
    // The longest words: the batch with the most stops.
    const b = batches.reduce((a, c) => (c.stopCount > a.stopCount ? c : a));

    await page.goto(`${APP_URL}/waves/${waveId}`);
    const cell = page.getByText(b.certificate, { exact: true }).first();
    await cell.waitFor();
    // The batch table scrolls sideways in its own box; the words wrap in a column, not one long line.
    expect((await cell.boundingBox())!.width).toBeLessThanOrEqual(WIDTH - 100);
    expect(await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth)).toBeLessThanOrEqual(0);
    await page.screenshot({ path: path.join(ARTIFACTS, "route-certificate-wave-390.png"), fullPage: true });

    await page.goto(`${APP_URL}/waves/${waveId}/batches/${b.number}`);
    const line = page.getByTestId("route-certificate");
    await line.waitFor();
    expect(await line.textContent()).toContain(`Route: ${b.certificate}`);
    await fitsScreen(page, line);
    await page.screenshot({ path: path.join(ARTIFACTS, "route-certificate-batch-390.png"), fullPage: true });

    await page.goto(`${APP_URL}/waves/${waveId}/batches/${b.number}/print`);
    const printed = page.getByTestId("route-certificate");
    await printed.waitFor();
    expect(await printed.textContent()).toContain(`Route: ${b.certificate}`);
    const box = (await printed.boundingBox())!;
    expect(box.x + box.width).toBeLessThanOrEqual(WIDTH);
    await page.screenshot({ path: path.join(ARTIFACTS, "route-certificate-print-390.png"), fullPage: true });
    await context.close();
  });
});
