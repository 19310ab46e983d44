import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser } from "playwright-core";
import path from "node:path";
import { APP_URL, signInAs } from "../support/app";
import { ARTIFACTS, launchBrowser } from "../support/browser";
import { signedInPage } from "../support/browser-session";
import { TestOrders } from "../support/wave-orders";
import { pickBatch, releasedWave } from "../support/short-pick-flow";
import { closeDb, db } from "@/db/knex";

// Two orders of this file's own due on 14 January 2026 (a day no other test uses), both picked short.
const TAG = `P${Date.now().toString(36).toUpperCase()}`;
const fixtures = new TestOrders();
let browser: Browser;
let waveId: number;

beforeAll(async () => {
  browser = await launchBrowser();
  const [item] = await fixtures.itemsOnLayout(1);
  const a = await fixtures.addOrder(`${TAG}-A`, "2026-01-14T08:00:00Z", [item!]);
  const b = await fixtures.addOrder(`${TAG}-B`, "2026-01-14T09:00:00Z", [item!]);
  await db()("order_lines").whereIn("order_id", [a, b]).update({ quantity: 4 });
  const wave = await releasedWave(await signInAs("planner"), `Short picks screen ${TAG}`, "2026-01-14T23:00:00Z");
  waveId = wave.waveId;
  fixtures.waveIds.push(waveId);
  for (const batch of wave.batches) await pickBatch(batch.id, () => 1);
}, 120_000);
afterAll(async () => {
  await browser?.close();
  const lines = await db()("order_lines").whereIn("order_id", fixtures.orderIds).pluck("id");
  await db()("bin_replenishments").whereIn("order_line_id", lines).delete();
  await fixtures.cleanUp();
  await closeDb();
});

describe("a supervisor follows up the shift's short picks", () => {
  it("re-picks one later, flags the bin and cancels the other, then clears the flag, on a handheld-sized screen", async () => {
    const { context, page } = await signedInPage(browser, "supervisor", { width: 390, height: 900 });
    await page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Short picks" }).click();
    await page.waitForURL(/\/short-picks$/);
    await page.locator("option", { hasText: `Short picks screen ${TAG}` }).waitFor({ state: "attached" });
    await page.getByLabel("Wave").selectOption({ label: `Short picks screen ${TAG}` });
    await page.getByText(/^2 short picks on .*, 2 still to follow up\./).waitFor();
    const cardA = page.getByRole("listitem", { name: `Short pick of order ${TAG}-A`, exact: false });
    const cardB = page.getByRole("listitem", { name: `Short pick of order ${TAG}-B`, exact: false });
    await cardA.getByText("3 short").waitFor();
    await cardA.getByText("Follow-up needed").waitFor();
    await page.screenshot({ path: path.join(ARTIFACTS, "short-picks-before.png"), fullPage: true });

    await cardA.getByRole("button", { name: "Re-pick later" }).click();
    await cardA.getByText("✓ Re-picked later").waitFor();
    await cardA.getByRole("link", { name: `${TAG}-A-R1` }).waitFor();

    await cardB.getByRole("button", { name: "Flag the bin for replenishment" }).click();
    await cardB.getByText(/⚑ Bin flagged for replenishment/).waitFor();
    const bin = (await cardB.locator("span.font-semibold").first().textContent())!.trim();
    const flag = page.getByTestId("replenishment").filter({ hasText: bin });
    await flag.waitFor();

    await cardB.getByRole("button", { name: "Cancel the rest of the line" }).click();
    await cardB.getByText("Nothing more will be picked for this line").waitFor();
    await cardB.getByRole("button", { name: "Yes, cancel the 3 not picked" }).click();
    await cardB.getByText(/✓ Rest cancelled by/).waitFor();
    await page.getByText(/^2 short picks on .*, 0 still to follow up\./).waitFor();
    // Nothing overflows the handheld's width.
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    await page.screenshot({ path: path.join(ARTIFACTS, "short-picks-after.png"), fullPage: true });

    await flag.getByRole("button", { name: "Done: bin refilled" }).click();
    await flag.waitFor({ state: "detached" });

    // The order page shows what was chosen.
    await cardA.getByRole("link", { name: `${TAG}-A`, exact: true }).click();
    await page.waitForURL(/\/orders\/\d+$/);
    await page.getByTestId("order-status").getByText("Awaiting re-pick").waitFor();
    await page.getByText("the rest is re-picked later").waitFor();

    // An earlier day has none of them.
    await page.goto(`${APP_URL}/short-picks`);
    await page.getByLabel("Shift of").fill("2025-06-02");
    await page.getByText(/^No short picks on 02\/06\/2025\./).waitFor();
    await context.close();
  });
});
