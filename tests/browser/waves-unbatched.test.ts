import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser } from "playwright-core";
import path from "node:path";
import { APP_URL } from "../support/app";
import { ARTIFACTS, launchBrowser } from "../support/browser";
import { signedInPage } from "../support/browser-session";
import { TestOrders } from "../support/wave-orders";
import { closeDb, db } from "@/db/knex";

const TAG = `B${Date.now().toString(36).toUpperCase()}`;
const fixtures = new TestOrders();
let browser: Browser;

beforeAll(async () => {
  browser = await launchBrowser();
  // One order the layout version can reach and two it cannot, all due on 8 January 2026: earlier than
  // any other open order, so a cut-off on 9 January takes exactly these three.
  const [onLayout] = await fixtures.itemsOnLayout(1);
  await fixtures.addOrder(`${TAG}-GOOD`, "2026-01-08T08:00:00Z", [onLayout!]);
  await fixtures.addOrder(`${TAG}-OFF`, "2026-01-08T09:00:00Z", [
    onLayout!,
    await fixtures.addItem(`${TAG}-OFF`, [`ZZ-${TAG}-1`]),
  ]);
  await fixtures.addOrder(`${TAG}-NOBIN`, "2026-01-08T10:00:00Z", [await fixtures.addItem(`${TAG}-NOBIN`, [])]);
});
afterAll(async () => {
  await browser?.close();
  await fixtures.cleanUp();
  await closeDb();
});

describe("a planner starts and releases a wave some of whose orders cannot be batched", () => {
  it("sees the count and the missing bins before planning, every unbatched order after, and is asked before they go back to open", async () => {
    const { context, page } = await signedInPage(browser, "planner", { width: 1400, height: 1000 });
    await page.goto(`${APP_URL}/waves`);
    await page.getByText(/This wave will take [\d,]+ open orders/).waitFor();
    // The count follows the filter before anything is created.
    await page.getByLabel("Cut-off up to (optional)").fill("2026-01-09T00:00");
    await page.getByText("This wave will take 3 open orders (4 order lines) that no other wave holds.").waitFor();
    const warning = page.getByText("⚠ 2 lines of 2 orders pick from bins that are not on");
    await warning.waitFor();
    await page.getByText(`${TAG}-OFF is in ZZ-${TAG}-1`).waitFor();
    await page.getByText(`${TAG}-NOBIN has no pick bin in the item master`).waitFor();
    await page.getByTestId("wave-preview").screenshot({ path: path.join(ARTIFACTS, "wave-preview.png") });

    const name = `Unbatched ${TAG}`;
    await page.getByLabel("Name").fill(name);
    await page.getByRole("button", { name: "Create the wave" }).click();
    await page.waitForURL(/\/waves\/\d+$/);
    fixtures.waveIds.push(Number(new URL(page.url()).pathname.split("/").pop()));
    await page.getByRole("button", { name: "Plan the wave" }).click();
    await page.getByRole("heading", { name: "⚠ 2 orders could not be batched" }).waitFor({ timeout: 60_000 });
    await page.getByRole("cell", { name: `${TAG}-NOBIN`, exact: true }).waitFor();

    await page.getByRole("button", { name: "Release 1 batch; 2 orders back to open" }).click();
    const question = page.getByRole("alertdialog");
    await question.getByText("The 2 orders no batch holds go back to open orders").waitFor();
    await page.screenshot({ path: path.join(ARTIFACTS, "wave-release-unbatched.png"), fullPage: true });
    await question.getByRole("button", { name: "Yes, release" }).click();
    await page.getByText(/They went back to open orders when the wave was released/).waitFor();

    const statuses = await db()("orders").whereIn("id", fixtures.orderIds).orderBy("id").pluck("status");
    expect(statuses).toEqual(["released", "open", "open"]);
    await page.goto(`${APP_URL}/orders`);
    await page.getByText(`⚠ Not batched in wave “${name}”`).first().waitFor();
    await page.screenshot({ path: path.join(ARTIFACTS, "orders-open-again.png"), fullPage: true });
    await context.close();
  });
});
