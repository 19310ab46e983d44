import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser } from "playwright-core";
import path from "node:path";
import { api, APP_URL, demoAccount, ORIGIN, signInAs } from "../support/app";
import { ARTIFACTS, launchBrowser } from "../support/browser";
import { signedInPage } from "../support/browser-session";
import { closeDb, db } from "@/db/knex";
import { TestOrders } from "../support/wave-orders";
import { createdWave, planWave } from "../support/wave-plan";
import { estimateSeconds, siteTiming } from "@/lib/batching/estimate";
import type { SiteDTO } from "@/lib/contracts/site";

// The demo site's settings are shared with the other test files: this file puts back what it found.
let browser: Browser;
let admin: string;
let original: SiteDTO;
const fixtures = new TestOrders();
const TAG = `SB${Date.now().toString(36).toUpperCase()}`;

const read = async () => (await api().get("/api/site").set("Cookie", admin)).body.site as SiteDTO;
const patch = (body: object) => api().patch("/api/site").set("Cookie", admin).set("Origin", ORIGIN).send(body);

beforeAll(async () => {
  browser = await launchBrowser();
  admin = await signInAs("admin");
  original = await read();
  // Start from day-first dates on a 24-hour clock, whatever an earlier run left.
  const res = await patch({ version: original.version, dateOrder: "dmy", clock: "24h", timezone: "Europe/London" });
  expect(res.status, JSON.stringify(res.body)).toBe(200);
});

afterAll(async () => {
  await browser?.close();
  await fixtures.cleanUp();
  const now = await read();
  await patch({
    version: now.version,
    name: original.name,
    timezone: original.timezone,
    dateOrder: original.dateOrder,
    clock: original.clock,
    units: original.units,
    walkingSpeedMPerS: original.walkingSpeedMmPerS / 1000,
    secondsPerLine: original.secondsPerLine,
    setupSecondsPerBatch: original.setupSecondsPerBatch,
    maxOpenBatchesPerPicker: original.maxOpenBatchesPerPicker,
  });
  await closeDb();
});

const DMY = /\d{2}\/\d{2}\/\d{4} \d{2}:\d{2}/;
const YMD_12H = /\d{4}-\d{2}-\d{2} \d{1,2}:\d{2} (AM|PM)/;

describe("an admin sets the site's date order", () => {
  it("sees the preview follow the form, saves, and every page writes dates the new way", async () => {
    const { context, page } = await signedInPage(browser, "admin");
    await page.getByRole("link", { name: "Settings" }).click();
    await page.waitForURL(/\/admin\/settings$/);
    const preview = page.getByTestId("date-preview");
    await expect.poll(() => preview.textContent()).toMatch(DMY);

    await page.getByLabel("Date order").selectOption("ymd");
    await page.getByLabel("Clock").selectOption("12h");
    // The preview changes before anything is saved.
    await expect.poll(() => preview.textContent()).toMatch(YMD_12H);
    await page.getByLabel(/Set-up time per batch/).fill("150");
    await expect
      .poll(() => page.getByTestId("estimate-preview").textContent())
      .toContain("2 min 30 s set-up per batch");
    await page.screenshot({ path: path.join(ARTIFACTS, "site-settings.png"), fullPage: true });

    await page.getByRole("button", { name: "Save settings" }).click();
    await page.getByText("Saved. Every screen, mail, print and estimate uses the new settings").waitFor();
    expect((await read()).dateOrder).toBe("ymd");

    // A server page and a client screen both write dates the new way.
    await page.goto(`${APP_URL}/floor-plans`);
    await expect
      .poll(() => page.locator("main").textContent())
      .toMatch(new RegExp(`Draft last saved ${YMD_12H.source}`));
    await page.goto(`${APP_URL}/admin/users`);
    const me = page.getByRole("row").filter({ hasText: demoAccount("admin").email });
    await expect.poll(() => me.textContent()).toMatch(YMD_12H);
    await page.screenshot({ path: path.join(ARTIFACTS, "site-settings-users-dates.png") });
    await context.close();
  });

  it("is told what to correct when a figure is out of range, and nothing is saved", async () => {
    const before = await read();
    const { context, page } = await signedInPage(browser, "admin", { width: 390, height: 844 });
    await page.goto(`${APP_URL}/admin/settings`);
    await page.getByLabel(/Walking speed with a cart/).fill("9");
    await page.getByLabel(/Open batches one picker may hold/).fill("11");
    await page.getByRole("button", { name: "Save settings" }).click();
    const alert = page.getByRole("alert").filter({ hasText: "Some fields need attention." });
    await alert.getByText(/Walking speed: .*at most 2\.5 m\/s/).waitFor();
    // No estimate is worked out from figures out of range.
    expect(await page.getByTestId("estimate-preview").count()).toBe(0);
    await alert.getByText(/at most 10 batches/).waitFor();
    await page.screenshot({ path: path.join(ARTIFACTS, "site-settings-390-refused.png"), fullPage: true });
    expect(await read()).toEqual(before);
    await context.close();
  });
});

describe("the wave page's estimated finish", () => {
  let waveId: number;
  let batchSeconds: number[];

  beforeAll(async () => {
    // A wave of this file's own: four one-line orders, two totes a cart, so two batches.
    const planner = await signInAs("planner");
    const items = await fixtures.itemsOnLayout(4);
    for (let i = 0; i < 4; i++) await fixtures.addOrder(`${TAG}-${i + 1}`, "2024-03-04T08:00:00Z", [items[i]!]);
    const res = await createdWave(planner, fixtures, {
      name: `Finish test ${TAG}`,
      cutoffBefore: "2024-03-05T00:00:00Z",
      settings: { totesPerCart: 2, method: "savings" },
    });
    waveId = res.body.id;
    const batches = (await planWave(planner, waveId)).batches as {
      distanceMm: number;
      lineCount: number;
    }[];
    expect(batches.length).toBe(2);
    const timing = siteTiming(await read());
    batchSeconds = batches.map((b) => estimateSeconds({ distanceMm: b.distanceMm, lines: b.lineCount }, timing));
  });

  it("follows the number of pickers typed, and says how many the cut-off needs", async () => {
    // A cut-off one picker misses (half the shorter batch too late) and two pickers make with a minute or more
    // to spare: the set-up alone makes every batch at least 2 minutes.
    const total = batchSeconds[0]! + batchSeconds[1]!;
    const shorter = Math.min(...batchSeconds);
    const cutoff = new Date(Date.now() + (total - shorter / 2) * 1000);
    await db()("orders").whereIn("id", fixtures.orderIds).update({ cutoff_at: cutoff });

    const { context, page } = await signedInPage(browser, "planner");
    await page.goto(`${APP_URL}/waves/${waveId}`);
    const section = page.getByRole("region", { name: "Estimated finish" });
    await section.getByText("set-up per batch (site settings)", { exact: false }).waitFor();
    const pickers = section.getByLabel("Pickers on shift");
    await pickers.fill("1");
    await section.getByText(/With 1 picker starting now/).waitFor();
    await section.getByText(/1 picker misses it by/).waitFor();
    await section.getByText(/it needs at least 2 pickers/).waitFor();
    await pickers.fill("0");
    await section.getByText("Enter a whole number of pickers from 1 to 200.").waitFor();
    await pickers.fill("2");
    await section.getByText(/2 pickers make it/).waitFor();
    await section.screenshot({ path: path.join(ARTIFACTS, "wave-finish.png") });
    await context.close();
  });
});
