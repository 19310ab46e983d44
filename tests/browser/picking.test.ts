import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser } from "playwright-core";
import path from "node:path";
import { APP_URL } from "../support/app";
import { ARTIFACTS, launchBrowser } from "../support/browser";
import { signedInPage } from "../support/browser-session";
import { closeDb, db } from "@/db/knex";

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await closeDb();
});

describe("the handheld", () => {
  it("works batch 1 to the end on a phone: scans typed by a wedge scanner, a wrong scan refused, one short pick, then the drop-off", async () => {
    const { context, page } = await signedInPage(browser, "picker", { width: 390, height: 844 });
    await page.goto(`${APP_URL}/my-batches`);
    await page
      .getByRole("link", { name: /picking batch 1$/ })
      .first()
      .waitFor();
    await page.screenshot({ path: path.join(ARTIFACTS, "my-batches-phone.png"), fullPage: true });

    const total = Number(
      (await db()("batch_lines").where({ batch_id: 1, pick_status: "open" }).count({ n: "*" }).first())!.n,
    );
    expect(total).toBeGreaterThan(1);
    await page.goto(`${APP_URL}/pick/1`);
    await page.locator(`[data-open-lines="${total}"]`).waitFor();
    await expect(page.getByTestId("stop-progress").textContent()).resolves.toMatch(/^Stop 1 of \d+$/);
    await page.screenshot({ path: path.join(ARTIFACTS, "pick-stop.png"), fullPage: true });

    // A wrong scan: refused with an ✕ and words, nothing counted, focus kept for the next scan.
    await page.keyboard.type("ZZ-99-9");
    await page.keyboard.press("Enter");
    const wrong = page.getByTestId("wrong-scan");
    await wrong.waitFor();
    await expect(wrong.textContent()).resolves.toMatch(/^✕ Wrong scan\. That is ZZ-99-9; this stop is bin /);
    await page.locator(`[data-open-lines="${total}"]`).waitFor();
    await page.screenshot({ path: path.join(ARTIFACTS, "pick-wrong-scan.png"), fullPage: true });

    for (let left = total; left > 0; left--) {
      await page.locator(`[data-open-lines="${left}"]`).waitFor();
      if (left === total - 1) {
        await page.getByRole("button", { name: "Short pick" }).click();
        await page.getByLabel(/Quantity found/).fill("0");
        await page.getByLabel("Reason").selectOption("damaged");
        await page.getByRole("button", { name: "Record short pick" }).click();
        continue;
      }
      expect(await page.evaluate(() => document.activeElement?.id)).toBe("scan");
      const bin = (await page.getByTestId("stop-location").textContent())!.trim();
      await page.keyboard.type(bin);
      await page.keyboard.press("Enter");
    }
    const done = page.getByTestId("batch-done");
    await done.waitFor();
    await expect(done.textContent()).resolves.toContain("Take the cart to P1");
    await page.getByTestId("queue-waiting").waitFor({ state: "detached" });
    await page.screenshot({ path: path.join(ARTIFACTS, "pick-done.png"), fullPage: true });

    // What the server recorded: every line once, one short with its reason, the batch done.
    for (let i = 0; i < 50; i++) {
      if ((await db()("batches").where({ id: 1 }).first("status")).status === "done") break;
      await new Promise((r) => setTimeout(r, 100));
    }
    expect((await db()("batches").where({ id: 1 }).first("status")).status).toBe("done");
    const lines = await db()("batch_lines").where({ batch_id: 1 }).select("pick_status", "picked_qty", "short_reason");
    expect(lines.filter((l: { pick_status: string }) => l.pick_status === "open")).toHaveLength(0);
    expect(lines.filter((l: { pick_status: string }) => l.pick_status === "short")).toEqual([
      { pick_status: "short", picked_qty: 0, short_reason: "damaged" },
    ]);
    await context.close();
  });
});
