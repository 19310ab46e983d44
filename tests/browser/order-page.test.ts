import { afterAll, beforeAll, describe, it } from "vitest";
import type { Browser } from "playwright-core";
import path from "node:path";
import { APP_URL, signInAs } from "../support/app";
import { ARTIFACTS, launchBrowser } from "../support/browser";
import { signedInPage } from "../support/browser-session";
import { TestOrders } from "../support/wave-orders";
import { releasedWave } from "../support/short-pick-flow";
import { closeDb, db } from "@/db/knex";

// Orders of this file's own due on 21 January 2026 (a day no other test uses), and one with no cut-off.
const TAG = `Q${Date.now().toString(36).toUpperCase()}`;
const fixtures = new TestOrders();
let browser: Browser;
let waveId: number;

beforeAll(async () => {
  browser = await launchBrowser();
  const items = await fixtures.itemsOnLayout(2);
  await fixtures.addOrder(`${TAG}-WAVE`, "2026-01-21T08:00:00Z", items);
  const wave = await releasedWave(await signInAs("planner"), `Order page ${TAG}`, "2026-01-21T23:00:00Z");
  waveId = wave.waveId;
  fixtures.waveIds.push(waveId);
  await fixtures.addOrder(`${TAG}-OPEN`, "2026-01-21T09:00:00Z", [items[0]!]);
  const none = await fixtures.addOrder(`${TAG}-NOCUT`, "2026-01-21T09:00:00Z", [items[1]!]);
  await db()("orders").where({ id: none }).update({ cutoff_at: null });
}, 120_000);
afterAll(async () => {
  await browser?.close();
  await fixtures.cleanUp();
  await closeDb();
});

describe("a planner looks up an order", () => {
  it("finds it in the list, whose count follows the search, and opens its page with lines, bins, batch and wave", async () => {
    const { context, page } = await signedInPage(browser, "planner", { width: 1280, height: 900 });
    await page.goto(`${APP_URL}/orders`);
    await page.getByLabel("Show").selectOption("all");
    await page.getByText(/^[\d,]+ orders, [\d,]+ order lines/).waitFor();
    await page.getByLabel("Search order, customer reference or status").fill(TAG);
    await page.getByText(/^3 of [\d,]+ orders match the search \(in all: [\d,]+ order lines/).waitFor();
    const row = page.getByRole("row").filter({ hasText: `${TAG}-WAVE` });
    await row.getByText("⚠ Overdue").waitFor();
    await page
      .getByRole("row")
      .filter({ hasText: `${TAG}-NOCUT` })
      .getByText("No cut-off")
      .waitFor();
    await page.screenshot({ path: path.join(ARTIFACTS, "orders-list.png"), fullPage: true });

    await row.getByRole("link", { name: `${TAG}-WAVE` }).click();
    await page.getByRole("heading", { name: `Order ${TAG}-WAVE`, level: 1 }).waitFor();
    await page
      .getByTestId("order-cutoff")
      .getByText(/Overdue/)
      .waitFor();
    await page.getByTestId("order-status").getByText("Not started").waitFor();
    await page.getByRole("link", { name: `Order page ${TAG}`, exact: true }).waitFor();
    const lines = page.getByTestId("order-line");
    await lines.nth(1).waitFor();
    await lines
      .first()
      .getByRole("link", { name: `#1 of Order page ${TAG}` })
      .waitFor();
    await lines.first().getByText("To pick").waitFor();
    await page.screenshot({ path: path.join(ARTIFACTS, "order-page.png"), fullPage: true });
    await lines
      .first()
      .getByRole("link", { name: `#1 of Order page ${TAG}` })
      .click();
    await page.waitForURL(new RegExp(`/waves/${waveId}/batches/1$`));
    await context.close();
  });

  it("the new-wave form counts the orders without a cut-off that a cut-off leaves out, and takes them when ticked", async () => {
    const { context, page } = await signedInPage(browser, "planner", { width: 1280, height: 1000 });
    await page.goto(`${APP_URL}/waves`);
    await page.getByText(/This wave will take [\d,]+ open orders/).waitFor();
    await page.getByLabel("Cut-off up to (optional)").fill("2026-01-21T23:00");
    await page.getByText(/This wave will take 1 open order \(1 order lines\)/).waitFor();
    const note = page.getByTestId("no-cutoff-orders");
    const text = (await note.getByText(/open orders? (has|have) no cut-off/).textContent())!;
    const k = Number(text.match(/^([\d,]+)/)![1]!.replace(/,/g, ""));
    await note.getByText("A cut-off filter leaves them out").waitFor();
    await note.getByLabel(/Include the [\d,]+ orders? without a cut-off/).check();
    await page.getByText(new RegExp(`This wave will take ${(1 + k).toLocaleString("en-GB")} open orders`)).waitFor();
    await note.getByText("They are included in this wave's count above.").waitFor();
    await page.getByTestId("wave-preview").screenshot({ path: path.join(ARTIFACTS, "wave-preview-no-cutoff.png") });
    await context.close();
  });
});
