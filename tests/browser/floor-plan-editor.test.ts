import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import path from "node:path";
import { APP_URL } from "../support/app";
import { ARTIFACTS, launchBrowser } from "../support/browser";
import { signedInPage } from "../support/browser-session";
import { buildLayout } from "@/lib/layout-versions/build";
import { accessDistance } from "@/lib/routing/access";
import { findBin } from "@/lib/routing/graph";
import { editorDocumentSchema } from "@/lib/floor-plan/document";
import { smallDocument } from "../support/documents";

const RULER_PX = 28;

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

/** Page coordinates of the centre of grid cell (x, y) on the editor's canvas. */
async function cellPoint(page: Page, gridWidth: number, x: number, y: number) {
  const svg = page.getByRole("application");
  const box = (await svg.boundingBox())!;
  const px = (box.width - RULER_PX) / gridWidth;
  return { x: box.x + RULER_PX + (x + 0.5) * px, y: box.y + RULER_PX + (y + 0.5) * px };
}

async function drag(page: Page, width: number, from: [number, number], to: [number, number]) {
  const a = await cellPoint(page, width, ...from);
  const b = await cellPoint(page, width, ...to);
  await page.mouse.move(a.x, a.y);
  await page.mouse.down();
  await page.mouse.move((a.x + b.x) / 2, (a.y + b.y) / 2, { steps: 4 });
  await page.mouse.move(b.x, b.y, { steps: 4 });
  await page.mouse.up();
}

async function tool(page: Page, name: string) {
  await page
    .getByRole("toolbar", { name: "Floor plan tools" })
    .getByRole("button", { name: new RegExp(`^${name}`) })
    .click();
}

async function click(page: Page, width: number, at: [number, number]) {
  const p = await cellPoint(page, width, ...at);
  await page.mouse.click(p.x, p.y);
}

describe("drawing a floor plan by mouse and publishing it", () => {
  it("two rack runs along an aisle between two cross-aisles, a depot and a drop-off; the distance shown is the engine's", async () => {
    const { context, page } = await signedInPage(browser, "admin", { width: 1400, height: 1000 });
    const W = 12;
    await page.goto(`${APP_URL}/floor-plans`);
    await page.getByLabel("Name").fill(`Mezzanine ${Date.now()}`);
    await page.getByLabel("Width (m)").fill(String(W));
    await page.getByLabel("Depth (m)").fill("7");
    await page.getByRole("button", { name: "Create and open the editor" }).click();
    await page.waitForURL(/\/floor-plans\/\d+$/);
    await page.getByRole("application").waitFor();

    // Walkable floor everywhere: rows 0 and 6 become the cross-aisles, row 3 the aisle between the racks.
    await tool(page, "Floor");
    await page.getByRole("button", { name: "Rectangle" }).click();
    await drag(page, W, [0, 0], [W - 1, 6]);

    await tool(page, "Rack run");
    await drag(page, W, [1, 2], [10, 2]);
    await page.getByLabel("Picked from").selectOption("S");
    await page.getByLabel("Levels").fill("2");
    await page.getByRole("button", { name: "Add rack run", exact: true }).click();

    await tool(page, "Rack run");
    await drag(page, W, [1, 4], [10, 4]);
    await page.getByLabel("Picked from").selectOption("N");
    await page.getByLabel("First bay").fill("11");
    await page.getByRole("button", { name: "Add rack run", exact: true }).click();

    await tool(page, "Depot");
    await click(page, W, [0, 6]);
    await tool(page, "Drop-off");
    await click(page, W, [W - 1, 6]);

    await page.getByText(/No problems/).waitFor();
    await page.screenshot({ path: path.join(ARTIFACTS, "editor-drawn.png"), fullPage: true });

    await page.getByRole("button", { name: /publish/i }).click();
    const open = page.getByRole("link", { name: /Open layout version 1/ });
    await open.waitFor({ timeout: 30_000 });
    await open.click();
    await page.waitForURL(/\/versions\/1$/);

    // The engine's answer on the document as the server stored it.
    const planId = Number(new URL(page.url()).pathname.split("/")[2]);
    const api = await context.request.get(`${APP_URL}/api/floor-plans/${planId}/versions/1`);
    expect(api.ok()).toBe(true);
    const { version, bins } = (await api.json()) as {
      version: { document: unknown };
      bins: { code: string; rackRun: string }[];
    };
    const doc = editorDocumentSchema.parse(version.document);
    expect(doc.rackRuns).toHaveLength(2);
    expect(bins).toHaveLength(2 * 10 * 2);
    const from = bins.find((b) => b.rackRun === doc.rackRuns[0]!.id)!.code;
    const to = bins.filter((b) => b.rackRun === doc.rackRuns[1]!.id).at(-1)!.code;
    const { graph, matrix } = await buildLayout(doc);
    const a = findBin(graph, from)!;
    const b = findBin(graph, to)!;
    const expected = accessDistance(
      graph,
      matrix,
      graph.accessPoints[a.accessPoint]!,
      graph.accessPoints[b.accessPoint]!,
    );

    await page.getByLabel("From bin").fill(from);
    await page.getByLabel("To bin").fill(to);
    await page.getByRole("button", { name: "Measure" }).click();
    const status = page.getByRole("status").filter({ hasText: "mm on foot" });
    await status.waitFor();
    const shownMm = Number((await status.textContent())!.match(/\(([\d,]+) mm/)![1]!.replace(/,/g, ""));
    expect(shownMm).toBe(expected);

    // Hovering a bay says how far it is from the depot.
    const svg = page.getByRole("img", { name: /Published floor plan/ });
    const box = (await svg.boundingBox())!;
    await page.mouse.move(box.x + (5.5 / W) * box.width, box.y + (2.5 / 7) * box.height);
    await expect(page.getByTestId("hover-info").textContent()).resolves.toMatch(/m walk from/);
    await page.screenshot({ path: path.join(ARTIFACTS, "layout-version.png"), fullPage: true });
    await context.close();
  });
});

describe("editor uploads", () => {
  const PNG = Buffer.from(
    "89504e470d0a1a0a0000000d49484452000000010000000108060000001f15c4890000000d49444154789c6360000002000154a24f5d0000000049454e44ae426082",
    "hex",
  );

  it("imports a rack run's codes from a CSV, shows bad rows by number, and lays a picture under the grid", async () => {
    const { context, page } = await signedInPage(browser, "admin", { width: 1400, height: 1000 });
    const origin = new URL(APP_URL).origin;
    const created = await context.request.post(`${APP_URL}/api/floor-plans`, {
      headers: { Origin: origin },
      data: { name: `Uploads ${Date.now()}`, widthM: 12, heightM: 7, cellMm: 1000 },
    });
    const { id } = (await created.json()) as { id: number };
    const saved = await context.request.put(`${APP_URL}/api/floor-plans/${id}/draft`, {
      headers: { Origin: origin },
      data: { version: 1, document: smallDocument() },
    });
    expect(saved.ok()).toBe(true);

    await page.goto(`${APP_URL}/floor-plans/${id}`);
    await page.getByRole("application").waitFor();
    await tool(page, "Select");
    await click(page, 12, [3, 2]);
    const upload = page.getByLabel("Import codes (.xlsx or .csv)");
    await upload.setInputFiles({
      name: "bad.csv",
      mimeType: "text/csv",
      buffer: Buffer.from("Location code,Bay,Level\nX-1,1,1\nX-2,99,1\n"),
    });
    await page.getByText(/row 3/i).first().waitFor();
    await upload.setInputFiles({
      name: "good.csv",
      mimeType: "text/csv",
      buffer: Buffer.from("Location code,Bay,Level\nDOCK-SPARES,1,1\n"),
    });
    await page.getByText(/1 code differs from the pattern/).waitFor();
    await page.getByText("DOCK-SPARES").first().waitFor();

    await page.getByText("Background picture", { exact: true }).click();
    await page
      .getByLabel("Background picture (PNG or JPEG)")
      .setInputFiles({ name: "plan.png", mimeType: "image/png", buffer: PNG });
    await page.locator("svg[role=application] image").waitFor({ state: "attached" });
    await page.screenshot({ path: path.join(ARTIFACTS, "editor-uploads.png"), fullPage: true });
    await context.close();
  });
});
