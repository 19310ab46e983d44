import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser } from "playwright-core";
import path from "node:path";
import { APP_URL } from "../support/app";
import { ARTIFACTS, launchBrowser } from "../support/browser";
import { signedInPage } from "../support/browser-session";
import { TestOrders } from "../support/wave-orders";
import { closeDb, db } from "@/db/knex";

// Three orders of this file's own, due in May 2019: earlier than any other open order, so a wave "up
// to the end of May 2019" takes exactly these.
const TAG = `W${Date.now().toString(36).toUpperCase()}`;
const fixtures = new TestOrders();
let browser: Browser;

beforeAll(async () => {
  browser = await launchBrowser();
  const items = await fixtures.itemsOnLayout(3);
  for (let i = 0; i < 3; i++) await fixtures.addOrder(`${TAG}-${i + 1}`, `2019-05-0${i + 1}T08:00:00Z`, [items[i]!]);
});
afterAll(async () => {
  await browser?.close();
  await fixtures.cleanUp();
  await closeDb();
});

describe("a planner edits, re-plans and releases a wave, then recalls a batch", () => {
  it("edits the settings and orders, re-plans with a smaller cart, confirms release in a dialog, recalls a batch", async () => {
    const { context, page } = await signedInPage(browser, "planner", { width: 1400, height: 1000 });
    await page.goto(`${APP_URL}/waves`);
    await page.getByLabel("Name").fill(`Control ${TAG}`);
    await page.getByLabel("Cut-off up to (optional)").fill("2019-05-31T23:59");
    await page.getByText("This wave will take 3 open orders").waitFor();
    await page.getByLabel("Totes per cart (one order per tote)").fill("3");
    await page.getByRole("button", { name: "Create the wave" }).click();
    await page.waitForURL(/\/waves\/\d+$/);
    const waveId = Number(new URL(page.url()).pathname.split("/").pop());
    fixtures.waveIds.push(waveId);

    // Edit the draft: a new name, first come, and one order taken out by hand.
    await page.getByRole("button", { name: "Edit wave" }).click();
    const editor = page.getByRole("region", { name: "Edit the wave" });
    await editor.getByLabel("Name", { exact: true }).fill(`Edited ${TAG}`);
    await editor.getByLabel("Batching").selectOption("first-come");
    await editor.getByRole("button", { name: "Save changes" }).click();
    await page.getByRole("heading", { name: `Edited ${TAG}`, level: 1 }).waitFor();
    const stored = (await db()("waves").where({ id: waveId }).first("settings")).settings;
    expect(typeof stored === "string" ? JSON.parse(stored) : stored).toMatchObject({ method: "first-come" });

    await page.getByRole("button", { name: "Edit wave" }).click();
    await editor.getByRole("table", { name: "Orders in this wave" }).waitFor();
    await editor.getByLabel(`Tick order ${TAG}-3`).check();
    await page.screenshot({ path: path.join(ARTIFACTS, "wave-editor-draft.png"), fullPage: true });
    await editor.getByRole("button", { name: "Take 1 order out" }).click();
    await page.getByText(/^2 orders on /).waitFor();
    expect(await db()("orders").whereIn("id", fixtures.orderIds).orderBy("id").pluck("status")).toEqual([
      "planned",
      "planned",
      "open",
    ]);

    // Plan with carts of 3 totes: one batch.
    await page.getByRole("button", { name: "Plan the wave" }).click();
    await page.getByText(/Planned 1 batches/).waitFor({ timeout: 60_000 });
    await page.getByRole("link", { name: "#1", exact: true }).waitFor();
    expect(await page.getByRole("link", { name: "#2", exact: true }).count()).toBe(0);

    // Re-plan with one tote per cart: the editor says the plan is thrown away, and two batches come back.
    await page.getByRole("button", { name: "Re-plan…" }).click();
    await editor.getByText(/throws its plan away/).waitFor();
    await editor.getByLabel("Totes per cart (one order per tote)").fill("1");
    await page.screenshot({ path: path.join(ARTIFACTS, "wave-editor-replan.png"), fullPage: true });
    await editor.getByRole("button", { name: "Save and re-plan" }).click();
    await page.getByText(/Planned 2 batches/).waitFor({ timeout: 60_000 });
    await page.getByRole("link", { name: "#2", exact: true }).waitFor();

    // Release asks first, in a modal dialog that takes the focus and names what will happen.
    const releaseButton = page.getByRole("button", { name: "Release to pickers" });
    await releaseButton.click();
    const dialog = page.getByRole("alertdialog", { name: "Release the wave?" });
    await dialog.waitFor();
    await dialog.getByText("2 batches go to pickers.").waitFor();
    await dialog.getByText("0 orders not in any batch go back to open.").waitFor();
    expect(await page.evaluate(() => document.activeElement?.textContent)).toBe("Not yet");
    await page.screenshot({ path: path.join(ARTIFACTS, "wave-release-dialog.png"), fullPage: true });
    await page.keyboard.press("Escape");
    await dialog.waitFor({ state: "hidden" });
    expect((await db()("waves").where({ id: waveId }).first("status")).status).toBe("planned");
    expect(await page.evaluate(() => document.activeElement?.textContent)).toBe("Release to pickers");
    await releaseButton.click();
    await dialog.getByRole("button", { name: "Yes, release" }).click();
    await page.getByText("● Released: the batches are locked").waitFor();

    // Recall batch 1, nobody has started it: its order is open again and the batch shows as recalled.
    const recallPanel = page.getByRole("region", { name: "Not started yet" });
    await recallPanel.getByRole("button", { name: "Recall batch 1" }).click();
    await recallPanel.getByRole("alertdialog").getByText("Recall batch 1?").waitFor();
    await page.screenshot({ path: path.join(ARTIFACTS, "wave-recall-question.png"), fullPage: true });
    await recallPanel.getByRole("button", { name: "Yes, recall it" }).click();
    await page.getByRole("cell", { name: "recalled", exact: true }).waitFor();
    await page.screenshot({ path: path.join(ARTIFACTS, "wave-recalled.png"), fullPage: true });
    const batch1 = await db()("batches").where({ wave_id: waveId, number: 1 }).first("id", "status");
    expect(batch1.status).toBe("recalled");
    const statuses = (await db()("orders").whereIn("id", fixtures.orderIds).pluck("status")) as string[];
    expect(statuses.sort()).toEqual(["open", "open", "released"]);
    await context.close();

    // A picker who opens the recalled batch on a handheld is told why, not shown an error page.
    const handheld = await signedInPage(browser, "picker", { width: 390, height: 844 });
    await handheld.page.goto(`${APP_URL}/pick/${batch1.id}`);
    await handheld.page.getByText("This batch was recalled by the planner").waitFor();
    await handheld.page.screenshot({ path: path.join(ARTIFACTS, "pick-recalled-390.png"), fullPage: true });
    await handheld.context.close();
  });
});
