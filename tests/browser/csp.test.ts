import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, BrowserContext, Page } from "playwright-core";
import { APP_URL, demoAccount } from "../support/app";
import { launchBrowser } from "../support/browser";
import { signInOnPage } from "../support/browser-session";
import { concretePage, discoverRoutes } from "../support/app-routes";
import { clearProblems, isHydrated, watchProblems, type PageProblems } from "../support/csp-watch";
import { smallDocument } from "../support/documents";
import { PAGE_ACCESS } from "@/lib/auth/access-table";
import { ROLE_HOME, ROLES, roleMay, type Role } from "@/lib/auth/permissions";

// Every page as every role that may open it, under the production CSP: no violation reported
// (securitypolicyviolation events, Chromium's "Refused to …" console messages), no script error, and
// the page did its client-side work: React hydrated it, the font loaded, SWR data or a client
// component shows.
const { pages } = discoverRoutes();

/** What each page shows only once its client code ran (SWR data, client components). */
const WORKS: Record<string, (page: Page, role: Role) => Promise<void>> = {
  "/": async (page, role) => void (await page.waitForURL((u) => u.pathname === ROLE_HOME[role])),
  "/sign-in": async (page, role) => void (await page.waitForURL((u) => u.pathname === ROLE_HOME[role])),
  "/set-password": async (page) => void (await page.getByRole("heading", { level: 1 }).waitFor()),
  "/forgot-password": async (page) => void (await page.getByRole("heading", { level: 1 }).waitFor()),
  "/floor-plans": async (page) => void (await page.getByRole("heading", { name: "Floor plans" }).waitFor()),
  // The editor appears once SWR has fetched the draft.
  "/floor-plans/[id]": async (page) => void (await page.getByRole("application").waitFor()),
  "/floor-plans/[id]/versions/[number]": async (page) =>
    void (await page
      .getByRole("img", { name: /floor plan/i })
      .first()
      .waitFor()),
  // Only those who plan see the form; a supervisor reads the list.
  "/waves": async (page, role) =>
    void (await (
      roleMay(role, "waves.plan")
        ? page.getByRole("button", { name: "Create the wave" })
        : page.getByRole("heading", { name: "Waves", level: 1 })
    ).waitFor()),
  "/waves/[id]": async (page) => void (await page.getByRole("link", { name: "#1", exact: true }).waitFor()),
  "/waves/[id]/batches/[number]": async (page) =>
    void (await page.getByRole("img", { name: /Route of this batch/ }).waitFor()),
  "/waves/[id]/batches/[number]/print": async (page) => expectBarcode(page),
  "/waves/[id]/print": async (page) => expectBarcode(page),
  "/floor": async (page) => void (await page.getByText(/^Updated \d/).waitFor()),
  "/my-batches": async (page) => void (await page.getByRole("heading", { name: "My batches" }).waitFor()),
  "/pick/[batchId]": async (page) =>
    void (await page.locator("[data-testid=stop-progress], [data-testid=batch-done], .notice-error").first().waitFor()),
  // Admins sort first, so the demo admin is on the first page however many users other tests made.
  "/admin/users": async (page) => void (await page.getByText(demoAccount("admin").email).first().waitFor()),
  "/admin/mail": async (page) => void (await page.getByRole("heading", { name: /^Received \(\d+\)$/ }).waitFor()),
  "/admin/settings": async (page) => void (await page.getByTestId("estimate-preview").waitFor()),
  "/items": async (page) => void (await page.getByText(/^[\d,]+ SKUs/).waitFor()),
  "/orders": async (page) => void (await page.getByText(/[\d,]+ orders, [\d,]+ order lines/).waitFor()),
  "/orders/[id]": async (page) => void (await page.getByTestId("order-line").first().waitFor()),
  "/short-picks": async (page) => void (await page.getByTestId("short-picks-count").waitFor()),
};

/** The barcode is inline SVG markup from the server: it must be there and drawn at a real size. */
async function expectBarcode(page: Page) {
  const svg = page.getByTestId("batch-barcode").first().locator("svg");
  await svg.waitFor();
  const box = await svg.boundingBox();
  expect(box?.width).toBeGreaterThan(100);
  expect(await page.getByTestId("pick-line").count()).toBeGreaterThan(0);
}

async function expectClean(problems: PageProblems) {
  expect(problems.violations, "CSP violations").toEqual([]);
  expect(problems.console, "console messages about the CSP").toEqual([]);
  expect(problems.errors, "script errors").toEqual([]);
  expect(problems.dialogs, "dialogs").toEqual([]);
}

async function visit(page: Page, problems: PageProblems, pattern: string, role?: Role) {
  const check = WORKS[pattern];
  expect(check, `add ${pattern} to WORKS in tests/browser/csp.test.ts`).toBeDefined();
  clearProblems(problems);
  await page.goto(`${APP_URL}${concretePage(pattern)}`);
  await check!(page, role ?? "picker");
  await page.waitForLoadState("networkidle");
  expect(await isHydrated(page), `${pattern} hydrated`).toBe(true);
  expect(
    await page.evaluate(() => document.fonts.ready.then((f) => [...f].some((font) => font.status === "loaded"))),
    "the app's font loaded",
  ).toBe(true);
  await expectClean(problems);
}

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

describe("anonymous visitors", () => {
  let context: BrowserContext;
  let page: Page;
  let problems: PageProblems;
  beforeAll(async () => {
    context = await browser.newContext();
    problems = await watchProblems(context);
    page = await context.newPage();
  });
  afterAll(async () => context?.close());

  it.each(pages.filter((p) => PAGE_ACCESS[p] === "public" && p !== "/sign-in"))("%s runs under the policy", async (p) =>
    visit(page, problems, p),
  );

  it("the sign-in form works under the policy, and a page that needs a session sends there", async () => {
    clearProblems(problems);
    await page.goto(`${APP_URL}/items`);
    await page.waitForURL(/\/sign-in\?next=%2Fitems$/);
    await page.getByLabel("E-mail address").fill("nobody@tests.example");
    await page.getByLabel("Password").fill("wrong password");
    await page.getByRole("button", { name: "Sign in" }).click();
    // The message comes from the form's own fetch: client code and connect-src both work.
    await page
      .getByRole("alert")
      .filter({ hasText: /do not match/ })
      .waitFor();
    expect(await isHydrated(page)).toBe(true);
    await expectClean(problems);
  });
});

for (const role of ROLES) {
  describe(`signed in as ${role}`, () => {
    let context: BrowserContext;
    let page: Page;
    let problems: PageProblems;
    beforeAll(async () => {
      context = await browser.newContext({
        viewport: role === "picker" ? { width: 390, height: 844 } : { width: 1280, height: 900 },
      });
      problems = await watchProblems(context);
      page = await context.newPage();
      await signInOnPage(page, role);
      await page.waitForURL((u) => u.pathname === ROLE_HOME[role]);
    });
    afterAll(async () => context?.close());

    it.each(pages.filter((p) => roleMay(role, PAGE_ACCESS[p]!)))("%s runs under the policy", async (p) =>
      visit(page, problems, p, role),
    );
  });
}

describe("pictures under the policy", () => {
  const PNG = Buffer.from(
    "89504e470d0a1a0a0000000d49484452000000010000000108060000001f15c4890000000d49444154789c6360000002000154a24f5d0000000049454e44ae426082",
    "hex",
  );

  it("a floor plan's background picture loads in the editor, with no violation", async () => {
    const context = await browser.newContext({ viewport: { width: 1400, height: 1000 } });
    const problems = await watchProblems(context);
    const page = await context.newPage();
    await signInOnPage(page, "admin");
    await page.waitForURL((u) => u.pathname === ROLE_HOME.admin);
    const origin = new URL(APP_URL).origin;
    const created = await context.request.post(`${APP_URL}/api/floor-plans`, {
      headers: { Origin: origin },
      data: { name: `CSP pictures ${Date.now()}`, widthM: 12, heightM: 7, cellMm: 1000 },
    });
    const { id } = (await created.json()) as { id: number };
    const saved = await context.request.put(`${APP_URL}/api/floor-plans/${id}/draft`, {
      headers: { Origin: origin },
      data: { version: 1, document: smallDocument() },
    });
    expect(saved.ok()).toBe(true);

    await page.goto(`${APP_URL}/floor-plans/${id}`);
    await page.getByRole("application").waitFor();
    await page.getByText("Background picture", { exact: true }).click();
    const picture = page.waitForResponse(
      (r) =>
        /\/api\/floor-plans\/\d+\/background\/[^/]+$/.test(new URL(r.url()).pathname) && r.request().method() === "GET",
    );
    await page
      .getByLabel("Background picture (PNG or JPEG)")
      .setInputFiles({ name: "plan.png", mimeType: "image/png", buffer: PNG });
    const res = await picture;
    expect(res.status()).toBe(200);
    expect(res.headers()["content-type"]).toBe("image/png");
    await page.locator("svg[role=application] image").waitFor({ state: "attached" });
    await page.waitForLoadState("networkidle");
    await expectClean(problems);
    await context.close();
  });
});
