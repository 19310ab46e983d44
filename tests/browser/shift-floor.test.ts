import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import path from "node:path";
import { api, APP_URL, demoAccount, makeUser, signIn, signInAs } from "../support/app";
import { ARTIFACTS, launchBrowser } from "../support/browser";
import { signedInPage } from "../support/browser-session";
import { TestOrders } from "../support/wave-orders";
import { confirmLine, pickViewOf, releasedShiftWave } from "../support/shift-wave";
import { closeDb } from "@/db/knex";

const TAG = `SB${Date.now().toString(36).toUpperCase()}`;
const WAVE = `Shift ${TAG}`;
const fixtures = new TestOrders();
const SUPERVISOR = demoAccount("supervisor").displayName;

let browser: Browser;
let batches: { id: number; number: number }[];

type Picker = { id: string; email: string; password: string; name: string; cookie: string };
async function picker(): Promise<Picker> {
  const u = await makeUser("picker");
  const cookie = await signIn(u.email, u.password);
  const me = await api().get("/api/session").set("Cookie", cookie);
  return { ...u, name: me.body.user.displayName, cookie };
}

async function handheldOf(p: Picker): Promise<Page> {
  const context = await browser.newContext({ viewport: { width: 390, height: 844 } });
  const page = await context.newPage();
  await page.goto(`${APP_URL}/sign-in`);
  await page.getByLabel("E-mail address").fill(p.email);
  await page.getByLabel("Password").fill(p.password);
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL((u) => u.pathname === "/my-batches");
  return page;
}

const fitsWidth = (page: Page) =>
  page.evaluate(() => document.documentElement.scrollWidth <= document.documentElement.clientWidth);

beforeAll(async () => {
  browser = await launchBrowser();
  ({ batches } = await releasedShiftWave(await signInAs("planner"), TAG, 3, fixtures));
}, 120_000);
afterAll(async () => {
  await browser?.close();
  await fixtures.cleanUp();
  await closeDb();
});

describe("the supervisor's floor page", () => {
  it("updates while a picker confirms, and a move shows at once on the picker's handheld", async () => {
    const [p1, p2] = [await picker(), await picker()];
    const batch = batches[0]!;
    const { page } = await signedInPage(browser, "supervisor");
    // The supervisor's home is the floor.
    await page.waitForURL((u) => u.pathname === "/floor");
    await page.getByRole("heading", { name: "Shift floor", level: 1 }).waitFor();
    await page.getByLabel("Wave", { exact: true }).selectOption({ label: WAVE });
    const row = page
      .getByRole("row")
      .filter({ hasText: `#${batch.number}` })
      .filter({ hasText: WAVE });
    await expect(row.getByTestId("floor-status").textContent()).resolves.toBe("Waiting for a picker");
    // The counts follow the wave chosen: this test's three batches, all waiting.
    await expect(page.getByTestId("count-waiting").textContent()).resolves.toMatch(/^3\D/);

    // Assign the waiting batch to the first picker.
    await row.getByRole("button", { name: `Assign batch ${batch.number} of ${WAVE}` }).click();
    await page.getByLabel("Assign to").selectOption(p1.id);
    await page.getByRole("button", { name: "Assign the batch" }).click();
    await page
      .getByRole("status")
      .filter({ hasText: `is now ${p1.name}'s` })
      .waitFor();
    await row.getByText(p1.name, { exact: true }).waitFor();
    await page.getByRole("button", { name: "Close" }).click();

    // The picker sees it on their handheld, with who assigned it, and opens it.
    const hand = await handheldOf(p1);
    const card = hand.getByTestId("my-batch").filter({ hasText: WAVE });
    await expect(card.getByTestId("assigned-by").textContent()).resolves.toMatch(
      new RegExp(`^Assigned to you by ${SUPERVISOR} at \\d{1,2}:\\d{2}`),
    );
    expect(await fitsWidth(hand)).toBe(true);
    await hand.screenshot({ path: path.join(ARTIFACTS, "shift-my-batches-assigned-phone.png"), fullPage: true });
    await card.getByRole("link", { name: `Start picking batch ${batch.number}` }).click();
    await hand.waitForURL((u) => u.pathname === `/pick/${batch.id}`);
    await hand.locator('[data-open-lines="2"]').waitFor();

    // The picker confirms a line (from another handheld session, through the API): the floor follows without a reload.
    const updated = await page.getByText(/^Updated \d/).textContent();
    const view = await pickViewOf(p1.cookie, batch.id);
    expect((await confirmLine(p1.cookie, batch.id, view.lines[0]!, view.version)).status).toBe(200);
    await row
      .getByTestId("floor-lines")
      .filter({ hasText: /^1 of 2/ })
      .waitFor({ timeout: 20_000 });
    await expect(row.getByTestId("floor-status").textContent()).resolves.toMatch(/^Being picked/);
    await expect(page.getByTestId("count-in-progress").textContent()).resolves.toMatch(/^1\D/);
    expect(await page.getByText(/^Updated \d/).textContent()).not.toBe(updated);
    await page.screenshot({ path: path.join(ARTIFACTS, "shift-floor-in-progress.png"), fullPage: true });

    // Move the started batch to the second picker: the panel warns, the floor shows the new holder.
    await row.getByRole("button", { name: `Move or take back batch ${batch.number} of ${WAVE}` }).click();
    await page.getByText(`${p1.name} has started this batch`).waitFor();
    await page.getByLabel("Move to").selectOption(p2.id);
    await page.screenshot({ path: path.join(ARTIFACTS, "shift-floor-move-panel.png"), fullPage: true });
    await page.getByRole("button", { name: "Move the batch" }).click();
    await page
      .getByRole("status")
      .filter({ hasText: `is now ${p2.name}'s` })
      .waitFor();
    await row.getByText(p2.name, { exact: true }).waitFor();
    await row.getByText(new RegExp(`^moved by ${SUPERVISOR}`)).waitFor();

    // The first picker's screen says so by itself (its poll), and offers the way back.
    const gone = hand.getByTestId("batch-gone");
    await gone.waitFor({ timeout: 20_000 });
    await expect(gone.textContent()).resolves.toMatch(
      new RegExp(
        `^${SUPERVISOR} moved this batch to ${p2.name} at \\d{1,2}:\\d{2}( [AP]M)?\\. Your confirmed lines are kept\\.$`,
      ),
    );
    await hand.getByRole("link", { name: "Back to my batches" }).waitFor();
    expect(await fitsWidth(hand)).toBe(true);
    await hand.screenshot({ path: path.join(ARTIFACTS, "shift-pick-moved-phone.png"), fullPage: true });

    // The idle list names the first picker, who holds nothing now.
    // (Test accounts of other runs can share a display name: the entry is found by the account.)
    const idle = page.getByTestId("idle-pickers").locator(`[data-picker-id="${p1.id}"]`);
    await idle.waitFor({ timeout: 20_000 });
    await expect(idle.textContent()).resolves.toMatch(new RegExp(`^${p1.name} idle since \\d{1,2}:\\d{2}`));
    await page.screenshot({ path: path.join(ARTIFACTS, "shift-floor.png"), fullPage: true });
  });

  it("fits a phone held by a supervisor walking the floor: the table scrolls inside its box, the page does not", async () => {
    const { page } = await signedInPage(browser, "supervisor", { width: 390, height: 844 });
    await page.waitForURL((u) => u.pathname === "/floor");
    await page.getByRole("row").filter({ hasText: WAVE }).first().waitFor();
    expect(await fitsWidth(page)).toBe(true);
    await page.screenshot({ path: path.join(ARTIFACTS, "shift-floor-phone.png"), fullPage: true });
  });
});
