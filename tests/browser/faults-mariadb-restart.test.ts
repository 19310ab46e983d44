import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import { readFileSync } from "node:fs";
import path from "node:path";
import { api, APP_URL, ORIGIN, signInAs } from "../support/app";
import { ARTIFACTS, launchBrowser } from "../support/browser";
import { testService } from "../support/test-services";
import { closeDb, db } from "@/db/knex";
import { sinkMessagesTo } from "@/db/mail-sink";
import { pickerWithBatch } from "../support/jobs";

// MariaDB stopped and started again while a picker confirms on the handheld: the picks made while it
// is down wait on the device (the server answers 503 with words), go out by themselves once it is
// back, and count once each; the server itself stays up throughout (health says the database is
// down, pages show a readable error, the outbox sender goes on).

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  // Whatever happened above, the next test files need the database.
  await testService("mariadb", "start").catch(() => undefined);
  await browser?.close();
  await closeDb();
});

async function until<T>(what: string, timeoutMs: number, probe: () => Promise<T | undefined | false>): Promise<T> {
  const end = Date.now() + timeoutMs;
  for (;;) {
    const v = await probe().catch(() => undefined);
    if (v) return v;
    if (Date.now() > end) throw new Error(`${what} did not happen within ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 200));
  }
}

const serverPid = () => Number(readFileSync(path.resolve(process.cwd(), ".data/test/next.pid"), "utf8").trim());
const alive = (pid: number) => {
  try {
    process.kill(pid, 0);
    return true;
  } catch {
    return false;
  }
};

async function confirmedLines(batchId: number) {
  return (await db()("batch_lines as bl")
    .join("order_lines as l", "l.id", "bl.order_line_id")
    .where("bl.batch_id", batchId)
    .whereNot("bl.pick_status", "open")
    .select("bl.order_line_id", "bl.pick_status", "bl.picked_qty", "l.quantity")) as {
    order_line_id: number;
    pick_status: string;
    picked_qty: number;
    quantity: number;
  }[];
}
const confirmationCount = async (batchId: number) =>
  Number((await db()("pick_confirmations").where({ batch_id: batchId }).count({ n: "*" }).first())!.n);

async function tapPicked(page: Page, openBefore: number) {
  await page.locator(`[data-open-lines="${openBefore}"]`).waitFor();
  await page.getByRole("button", { name: /^Picked \d+/ }).click();
  await page.locator(`[data-open-lines="${openBefore - 1}"]`).waitFor();
}

describe("MariaDB restarted while a picker confirms", () => {
  it("queues the picks made while it is down, sends them when it is back, and counts each once", async () => {
    const { user: u, batchId } = await pickerWithBatch();
    const { wave_id: waveId } = await db()("batches").where({ id: batchId }).first("wave_id");
    const total = Number(
      (await db()("batch_lines").where({ batch_id: batchId, pick_status: "open" }).count({ n: "*" }).first())!.n,
    );
    expect(total).toBeGreaterThan(4);

    const context = await browser.newContext({ viewport: { width: 390, height: 844 } });
    const page = await context.newPage();
    await page.goto(`${APP_URL}/sign-in`);
    await page.getByLabel("E-mail address").fill(u.email);
    await page.getByLabel("Password").fill(u.password);
    await page.getByRole("button", { name: "Sign in" }).click();
    await page.waitForURL((url) => !url.pathname.startsWith("/sign-in"));
    await page.goto(`${APP_URL}/pick/${batchId}`);

    const answers: { status: number; retryAfter: string | null; body: unknown }[] = [];
    page.on("response", async (r) => {
      if (!r.url().endsWith(`/api/batches/${batchId}/confirm`)) return;
      answers.push({
        status: r.status(),
        retryAfter: r.headers()["retry-after"] ?? null,
        body: await r.json().catch(() => null),
      });
    });

    // Two picks with the database up: sent at once.
    await tapPicked(page, total);
    await tapPicked(page, total - 1);
    await page.getByTestId("queue-waiting").waitFor({ state: "detached" });
    await until("two confirmations stored", 10_000, async () => (await confirmedLines(batchId)).length === 2);

    const pid = serverPid();
    await testService("mariadb", "stop");
    try {
      // Two more with the database down: the screen moves on, the picks wait on the device.
      await tapPicked(page, total - 2);
      await tapPicked(page, total - 3);
      const waiting = page.getByTestId("queue-waiting");
      await waiting.waitFor();
      await until("both picks shown as waiting", 10_000, async () =>
        /^2 confirmations waiting to send/.test((await waiting.textContent()) ?? ""),
      );
      await page.screenshot({ path: path.join(ARTIFACTS, "pick-database-down.png"), fullPage: true });
      const refused = await until("a 503 answer to a confirmation", 10_000, async () =>
        answers.find((a) => a.status === 503),
      );
      expect(refused.retryAfter).toMatch(/^\d+$/);
      expect((refused.body as { error: string }).error).toMatch(/database|nothing was saved/i);
      expect(answers.filter((a) => a.status !== 503 && a.status !== 200)).toEqual([]);

      // The server is up and says what is wrong.
      const health = await api().get("/api/health");
      expect(health.status).toBe(503);
      expect(health.body).toEqual({ status: "unavailable", database: "database unavailable" });
      expect(alive(pid)).toBe(true);
      const other = await context.newPage();
      await other.goto(`${APP_URL}/my-batches`);
      await expect(other.getByRole("heading", { level: 1 }).textContent()).resolves.toBe(
        "This page could not be shown",
      );
      await expect(other.getByTestId("page-error").textContent()).resolves.toMatch(
        /database.*Wait a minute and try again/,
      );
      await other.close();
    } finally {
      await testService("mariadb", "start");
    }

    // Back: the queue drains by itself, no tap needed.
    await page.getByTestId("queue-waiting").waitFor({ state: "detached", timeout: 30_000 });
    await page.locator(`[data-open-lines="${total - 4}"]`).waitFor();
    await page.screenshot({ path: path.join(ARTIFACTS, "pick-database-back.png"), fullPage: true });

    // Each of the four confirmations once: four lines done with their full quantity, four records.
    const done = await confirmedLines(batchId);
    expect(done).toHaveLength(4);
    for (const l of done) expect(l).toMatchObject({ pick_status: "picked", picked_qty: l.quantity });
    expect(await confirmationCount(batchId)).toBe(4);

    // The planner sees what the screen shows.
    const planner = await signInAs("planner");
    const wave = await api().get(`/api/waves/${waveId}`).set("Cookie", planner);
    expect(wave.status).toBe(200);
    expect(wave.body.batches.find((b: { id: number }) => b.id === batchId)).toMatchObject({
      pickedLines: 4,
      shortLines: 0,
    });
    await page.reload();
    await page.locator(`[data-open-lines="${total - 4}"]`).waitFor();

    // The same server process throughout, healthy again, its outbox sender still sending.
    expect(serverPid()).toBe(pid);
    expect(alive(pid)).toBe(true);
    expect((await api().get("/api/health")).status).toBe(200);
    expect(
      (await api().post("/api/password/reset-request").set("Origin", ORIGIN).send({ email: u.email })).status,
    ).toBe(200);
    await until("the reset mail", 15_000, async () => (await sinkMessagesTo(u.email)).length === 1);
    await context.close();
  });
});
