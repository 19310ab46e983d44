import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import path from "node:path";
import { api, APP_URL, ORIGIN } from "../support/app";
import { ARTIFACTS, launchBrowser } from "../support/browser";
import { pickerWithBatch } from "../support/jobs";
import { startSecondServer, type SecondServer } from "../support/second-server";
import { closeDb, db } from "@/db/knex";

// The handheld's tap and scan belong to the line on screen: a double tap confirms one line, a stop
// spanning two bins takes a scan of either, and keys are made where crypto.randomUUID is missing.

type Line = { orderLineId: number; binCode: string; quantity: number; pickStatus: string };
type Stop = { seq: number; binCodes: string[]; lines: Line[] };
type Picker = Awaited<ReturnType<typeof pickerWithBatch>>;

const PHONE = { width: 390, height: 844 };
const HANDHELD_HOST = "handheld.trailbin.test";

let browser: Browser;
// The released pool is shared by every test file, so the double tap and the LAN test work one batch.
let handheld: Picker | undefined;
const handheldPicker = async () => (handheld ??= await pickerWithBatch());
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await closeDb();
});

async function until<T>(what: string, probe: () => Promise<T | undefined | false>, timeoutMs = 15_000): Promise<T> {
  const end = Date.now() + timeoutMs;
  for (;;) {
    const v = await probe();
    if (v) return v;
    if (Date.now() > end) throw new Error(`${what} did not happen within ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

async function signedInAs(b: Browser, base: string, p: Picker): Promise<Page> {
  const context = await b.newContext({ viewport: PHONE });
  const page = await context.newPage();
  await page.goto(`${base}/sign-in`);
  await page.getByLabel("E-mail address").fill(p.user.email);
  await page.getByLabel("Password").fill(p.user.password);
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL((u) => !u.pathname.startsWith("/sign-in"));
  return page;
}

async function viewOf(p: Picker): Promise<{ stops: Stop[]; batch: { version: number } }> {
  const res = await api().get(`/api/batches/${p.batchId}/pick`).set("Cookie", p.cookie);
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  return res.body;
}

const pickStatus = async (orderLineId: number) =>
  (await db()("batch_lines").where({ order_line_id: orderLineId }).first("pick_status")).pick_status as string;
const closedLines = async (batchId: number) =>
  Number(
    (await db()("batch_lines")
      .where({ batch_id: batchId })
      .whereNot({ pick_status: "open" })
      .count({ n: "*" })
      .first())!.n,
  );

async function scanShown(page: Page) {
  const bin = (await page.getByTestId("stop-location").textContent())!.trim();
  await page.locator("#scan").fill(bin);
  await page.locator("#scan").press("Enter");
}

describe("the handheld confirms only what the picker saw", () => {
  it("a quick double tap on the last line of a stop confirms that line only, never the first line of the next stop in another bin", async () => {
    const p = await handheldPicker();
    const { stops } = await viewOf(p);
    expect(stops.length, "a batch of at least two stops").toBeGreaterThan(1);
    const [first, second] = [stops[0]!, stops[1]!];
    expect(
      stops.flatMap((s) => s.lines).every((l) => l.pickStatus === "open"),
      "a batch nobody has started",
    ).toBe(true);
    const total = stops.reduce((n, s) => n + s.lines.length, 0);
    const page = await signedInAs(browser, APP_URL, p);
    await page.goto(`${APP_URL}/pick/${p.batchId}`);
    await page.locator(`[data-open-lines="${total}"]`).waitFor();
    // Every line of the first stop but its last by scan, so the tap lands on the stop's last line.
    for (let i = 0; i < first.lines.length - 1; i++) {
      await page.locator(`[data-open-lines="${total - i}"]`).waitFor();
      await scanShown(page);
    }
    const left = total - (first.lines.length - 1);
    await page.locator(`[data-open-lines="${left}"]`).waitFor();
    const button = page.getByRole("button", { name: /^Picked \d+/ });
    // A person's double tap: the second lands on the button a moment later, once the screen has moved
    // on to the next stop. Forced, so it is sent even at a disabled button (which the browser ignores).
    await button.click();
    await page.locator(`[data-open-lines="${left - 1}"]`).waitFor();
    await page.waitForTimeout(150);
    await button.click({ force: true });
    await until("the tap's confirmation stored", async () => (await closedLines(p.batchId)) >= first.lines.length);
    await page.getByTestId("queue-waiting").waitFor({ state: "detached" });
    expect(await page.locator("[data-open-lines]").getAttribute("data-open-lines")).toBe(String(left - 1));
    expect(await closedLines(p.batchId)).toBe(first.lines.length);
    expect(await pickStatus(second.lines[0]!.orderLineId)).toBe("open");
    await expect(page.getByTestId("stop-location").textContent()).resolves.toBe(second.lines[0]!.binCode);

    // A tap meant for the new stop, once it has been on screen, is taken.
    await button.click();
    await until(
      "the next stop's tap stored",
      async () => (await pickStatus(second.lines[0]!.orderLineId)) === "picked",
    );
    await page.context().close();
  });

  it("a stop with lines in two bins shows each line's bin, and a scan of the second bin picks the second line", async () => {
    const p = await pickerWithBatch();
    const { stops, batch } = await viewOf(p);
    let at = stops.findIndex((s) => new Set(s.lines.map((l) => l.binCode)).size > 1);
    if (at < 0) {
      // None in this batch: a line of the next stop moves into the first one, as when two bins face each other across an aisle.
      expect(stops.length, "a batch of at least two stops").toBeGreaterThan(1);
      const moved = stops[1]!.lines.at(-1)!;
      await db()("batch_lines")
        .where({ batch_id: p.batchId, order_line_id: moved.orderLineId })
        .update({ stop_seq: stops[0]!.seq });
      at = 0;
    }
    // Lines before that stop are picked already (through the API, as another screen would).
    for (const l of stops.slice(0, at).flatMap((s) => s.lines)) {
      const r = await api()
        .post(`/api/batches/${p.batchId}/confirm`)
        .set("Cookie", p.cookie)
        .set("Origin", ORIGIN)
        .send({
          idempotencyKey: `two-bins-${l.orderLineId}`,
          orderLineId: l.orderLineId,
          quantity: l.quantity,
          binCode: l.binCode,
          batchVersion: batch.version,
        });
      expect(r.status, JSON.stringify(r.body)).toBe(200);
    }
    const stop = (await viewOf(p)).stops.find((s) => s.seq === stops[at]!.seq)!;
    const bins = stop.lines.map((l) => l.binCode);
    expect(new Set(bins).size).toBeGreaterThan(1);
    const page = await signedInAs(browser, APP_URL, p);
    await page.goto(`${APP_URL}/pick/${p.batchId}`);
    await page.getByTestId("stop-bins").waitFor();
    expect((await page.getByTestId("line-bin").allTextContents()).map((t) => t.trim())).toEqual(
      bins.map((b) => `Bin ${b}`),
    );
    await page.screenshot({ path: path.join(ARTIFACTS, "pick-two-bins-phone.png"), fullPage: true });

    const shown = (await page.getByTestId("stop-location").textContent())!.trim();
    const other = stop.lines.find((l) => l.binCode !== shown)!;
    const open = Number(await page.locator("[data-open-lines]").getAttribute("data-open-lines"));
    await page.locator("#scan").fill(other.binCode);
    await page.locator("#scan").press("Enter");
    await page.locator(`[data-open-lines="${open - 1}"]`).waitFor();
    expect(await page.getByTestId("wrong-scan").count()).toBe(0);
    await until("the second bin's line stored", async () => (await pickStatus(other.orderLineId)) === "picked");
    expect(await pickStatus(stop.lines.find((l) => l.binCode === shown)!.orderLineId)).toBe("open");
    await page.context().close();
  });
});

describe("a handheld on the site's LAN over plain HTTP", () => {
  let second: SecondServer | undefined;
  let lan: Browser | undefined;
  afterAll(async () => {
    await lan?.close();
    await second?.stop();
  });

  it(`opens the pick screen through ${HANDHELD_HOST} (not a secure context, no crypto.randomUUID) and confirms a pick`, async () => {
    const port = process.env.TEST_SECOND_APP_PORT;
    expect(port, "TEST_SECOND_APP_PORT from npm test").toBeTruthy();
    const base = `http://${HANDHELD_HOST}:${port}`;
    // A server of its own that knows itself by the handheld's host name, so its Origin check accepts
    // that host whether it compares against the request's Host or against APP_ORIGIN.
    second = await startSecondServer({ APP_ORIGIN: base }, "lan-handheld");
    lan = await launchBrowser([`--host-resolver-rules=MAP ${HANDHELD_HOST} 127.0.0.1`]);
    const p = await handheldPicker();
    const page = await signedInAs(lan, base, p);
    await page.goto(`${base}/pick/${p.batchId}`);
    await page.getByTestId("stop-location").waitFor();
    const button = page.getByRole("button", { name: /^Picked \d+/ });
    // The line the screen shows: the first open one in walking order.
    const shown = (await viewOf(p)).stops.flatMap((st) => st.lines).find((l) => l.pickStatus === "open")!;
    await expect(page.getByTestId("stop-location").textContent()).resolves.toBe(shown.binCode);
    const lineId = shown.orderLineId;
    expect(
      await page.evaluate(() => ({
        secure: window.isSecureContext,
        randomUUID: typeof crypto.randomUUID,
        getRandomValues: typeof crypto.getRandomValues,
      })),
    ).toEqual({ secure: false, randomUUID: "undefined", getRandomValues: "function" });
    await page.screenshot({ path: path.join(ARTIFACTS, "pick-lan-phone.png"), fullPage: true });
    await button.click();
    await until("the pick made over plain HTTP stored", async () => (await pickStatus(lineId)) === "picked");
    await page.getByTestId("queue-waiting").waitFor({ state: "detached" });
    await expect(page.getByTestId("feedback").textContent()).resolves.toMatch(/^✓ .*picked\.$/);
    await page.context().close();
  });
});
