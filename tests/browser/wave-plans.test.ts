import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser } from "playwright-core";
import path from "node:path";
import { api, APP_URL, signInAs } from "../support/app";
import { ARTIFACTS, launchBrowser } from "../support/browser";
import { signedInPage } from "../support/browser-session";
import { watchProblems } from "../support/csp-watch";
import { TestOrders } from "../support/wave-orders";
import { createWave } from "@/db/waves";
import { closeDb, db } from "@/db/knex";

const TAG = `C${Date.now().toString(36).toUpperCase()}`;
const fixtures = new TestOrders();
let browser: Browser;
let waveId: number;

beforeAll(async () => {
  browser = await launchBrowser();
  const items = await fixtures.itemsOnLayout(30);
  const ids: number[] = [];
  for (let i = 0; i < 8; i++)
    ids.push(
      await fixtures.addOrder(`${TAG}-${i + 1}`, "2026-02-12T09:00:00Z", [
        items[(i * 7) % items.length]!,
        items[(i * 7 + 3) % items.length]!,
      ]),
    );
  const planner = await signInAs("planner");
  const plannerId = (await api().get("/api/session").set("Cookie", planner)).body.user.id;
  waveId = await createWave(
    await fixtures.siteId(),
    {
      name: `Plans compared ${TAG}`,
      layoutVersionId: 1,
      settings: {
        totesPerCart: 4,
        maxLines: 12,
        maxWeightG: 60_000,
        depotId: "D1",
        dropoffId: "P1",
        method: "first-come",
      },
      orderIds: ids,
    },
    plannerId,
  );
  fixtures.waveIds.push(waveId);
});

afterAll(async () => {
  await browser?.close();
  await fixtures.cleanUp();
  await closeDb();
});

describe("a planner compares plans of a wave and keeps one", () => {
  it("compares two plans, reads the table and chart against both baselines, and keeps the second", async () => {
    const { context, page } = await signedInPage(browser, "planner", { width: 1300, height: 1000 });
    const problems = await watchProblems(context);
    await page.goto(`${APP_URL}/waves/${waveId}`);
    const section = page.getByRole("region", { name: "Plans compared" });
    await section.getByText("No plans compared for this wave yet.").waitFor();
    const form = section.getByRole("form", { name: "Plans to compare" });
    // Plan 2 starts as route savings; give it smaller carts so the two plans differ in batches too.
    await form.getByRole("group", { name: "Plan 2" }).getByLabel("Totes per cart").fill("2");
    await form.getByRole("button", { name: "Compare these plans" }).click();
    await section.getByText(/Compared 2 plans on the same 8 orders/).waitFor({ timeout: 60_000 });

    const table = section.getByRole("table", { name: "Plans side by side" });
    await table.waitFor();
    await table.getByRole("columnheader", { name: "Plan 1" }).waitFor();
    await table.getByRole("columnheader", { name: "Plan 2" }).waitFor();
    await table.getByRole("rowheader", { name: "Against order by order" }).waitFor();
    await table.getByRole("rowheader", { name: "Against the usual walk" }).waitFor();
    // Every percentage names its baseline.
    const vsOrders = await table.getByRole("row", { name: /Against order by order/ }).innerText();
    expect(vsOrders).toMatch(/% (less|more) than order by order/);
    const vsUsual = await table.getByRole("row", { name: /Against the usual walk/ }).innerText();
    expect(vsUsual).toMatch(/% (less|more) than the usual walk/);
    const chart = section.getByRole("img", { name: /total walk against order by order and against the usual walk/ });
    await chart.waitFor();
    expect(await chart.getByText("Order by order (baseline)", { exact: true }).count()).toBe(2);
    expect(await chart.getByText("Usual walk (baseline)", { exact: true }).count()).toBe(2);
    await section.screenshot({ path: path.join(ARTIFACTS, "wave-plans-compared.png") });

    await table.getByRole("button", { name: "Keep plan 2" }).click();
    const question = section.getByRole("alertdialog");
    await question.getByText(/Keep “Route savings, 2 totes/).waitFor();
    await question.getByRole("button", { name: "Yes, keep this plan" }).click();
    await page.getByText("✓ the wave's plan").waitFor({ timeout: 30_000 });
    await page.getByText(/Carts of 2 totes/).waitFor();
    await page.getByText("batched by route savings", { exact: false }).first().waitFor();
    const batches = await db()("batches").where({ wave_id: waveId }).count({ n: "*" });
    const kept = await db()("wave_plans").where({ wave_id: waveId }).whereNotNull("kept_version").first("summary");
    const summary = typeof kept.summary === "string" ? JSON.parse(kept.summary) : kept.summary;
    expect(Number(batches[0]!.n)).toBe(summary.batches);
    await page.screenshot({ path: path.join(ARTIFACTS, "wave-plan-kept.png"), fullPage: true });
    expect(problems.violations).toEqual([]);
    expect(problems.errors).toEqual([]);
    await context.close();
  });

  it("fits a 390 px handheld screen for a supervisor, who reads the plans but has no form or keep buttons", async () => {
    const { context, page } = await signedInPage(browser, "supervisor", { width: 390, height: 844 });
    await page.goto(`${APP_URL}/waves/${waveId}`);
    const section = page.getByRole("region", { name: "Plans compared" });
    await section.getByRole("table", { name: "Plans side by side" }).waitFor();
    expect(await section.getByRole("form", { name: "Plans to compare" }).count()).toBe(0);
    expect(await section.getByRole("button", { name: /Keep plan/ }).count()).toBe(0);
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    expect(overflow).toBeLessThanOrEqual(0);
    await page.screenshot({ path: path.join(ARTIFACTS, "wave-plans-390.png"), fullPage: true });
    await context.close();
  });
});
