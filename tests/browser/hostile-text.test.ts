import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, BrowserContext, Page } from "playwright-core";
import path from "node:path";
import { APP_URL, demoAccount } from "../support/app";
import { ARTIFACTS, launchBrowser } from "../support/browser";
import { clearProblems, watchProblems, type PageProblems } from "../support/csp-watch";
import { buildHostileScenario, HOSTILE, HOSTILE_DROPOFF, hostileCode, type HostileScenario } from "../support/hostile";
import { closeDb } from "@/db/knex";

// The pages that show what people typed or imported, filled with HOSTILE text: each string must be
// on the page as the same literal text, with no element or attribute it could have injected, no
// dialog and no CSP violation (an injected inline handler would be one).

let browser: Browser;
let s: HostileScenario;
beforeAll(async () => {
  browser = await launchBrowser();
  s = await buildHostileScenario();
}, 180_000);
afterAll(async () => {
  await browser?.close();
  await closeDb();
});

async function signedIn(email: string, password: string, viewport = { width: 1280, height: 900 }) {
  const context = await browser.newContext({ viewport });
  const problems = await watchProblems(context);
  const page = await context.newPage();
  await page.goto(`${APP_URL}/sign-in`);
  await page.getByLabel("E-mail address").fill(email);
  await page.getByLabel("Password").fill(password);
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL((u) => !u.pathname.startsWith("/sign-in"));
  return { context, page, problems };
}

/** Elements and attributes that only exist if some text was parsed as markup or used as a link. */
function injected(page: Page): Promise<string[]> {
  return page.evaluate(() => {
    const found: string[] = [];
    for (const el of Array.from(document.querySelectorAll("*"))) {
      for (const a of Array.from(el.attributes))
        if (/^on/i.test(a.name)) found.push(`<${el.tagName.toLowerCase()} ${a.name}>`);
      const tag = el.tagName.toLowerCase();
      if (tag === "img" && ["x", ""].includes(el.getAttribute("src") ?? "")) found.push("<img src=x>");
      if (
        tag === "script" &&
        /alert\(1\)/.test(el.textContent ?? "") &&
        !/__next_f|self\.__next/.test(el.textContent ?? "")
      )
        found.push("<script>alert(1)</script>");
      for (const attr of ["href", "src", "action", "formaction", "xlink:href"]) {
        if (/^\s*javascript:/i.test(el.getAttribute(attr) ?? "")) found.push(`<${tag} ${attr}=javascript:…>`);
      }
    }
    return found;
  });
}

async function expectPlainText(page: Page, problems: PageProblems, texts: readonly string[], shot: string) {
  for (const t of texts) {
    await page.getByText(t).first().waitFor({ timeout: 15_000 });
  }
  await page.waitForLoadState("networkidle");
  await page.screenshot({ path: path.join(ARTIFACTS, `hostile-${shot}.png`), fullPage: true });
  expect(await injected(page)).toEqual([]);
  expect(problems.dialogs, "dialogs").toEqual([]);
  expect(problems.violations, "CSP violations").toEqual([]);
  expect(problems.errors, "script errors").toEqual([]);
  clearProblems(problems);
}

async function search(page: Page, label: RegExp, text: string) {
  await page.getByLabel(label).fill(text);
}

describe("hostile text shows as plain text", () => {
  let admin: { context: BrowserContext; page: Page; problems: PageProblems };
  let planner: { context: BrowserContext; page: Page; problems: PageProblems };
  let picker: { context: BrowserContext; page: Page; problems: PageProblems };
  beforeAll(async () => {
    admin = await signedIn(demoAccount("admin").email, demoAccount("admin").password);
    planner = await signedIn(demoAccount("planner").email, demoAccount("planner").password, {
      width: 1400,
      height: 1000,
    });
    picker = await signedIn(s.picker.email, s.picker.password, { width: 390, height: 844 });
  });
  afterAll(async () => {
    await Promise.all([admin?.context.close(), planner?.context.close(), picker?.context.close()]);
  });

  it("the users list", async () => {
    const { page, problems } = admin;
    await page.goto(`${APP_URL}/admin/users`);
    await search(page, /^Search name, e-mail or role/, s.tag.toLowerCase());
    await expectPlainText(page, problems, HOSTILE, "users");
  });

  it("the floor plans list, the draft's title and the published version's bins", async () => {
    const { page, problems } = admin;
    await page.goto(`${APP_URL}/floor-plans`);
    await expectPlainText(page, problems, s.planNames, "floor-plans");
    await page.goto(`${APP_URL}/floor-plans/${s.planId}`);
    await page.getByRole("application").waitFor();
    await expectPlainText(page, problems, [`${s.planNames[0]}: draft`], "floor-plan-draft");
    await page.goto(`${APP_URL}/floor-plans/${s.planId}/versions/1`);
    await search(page, /^Search location code, aisle or rack run/, "onerror");
    await expectPlainText(
      page,
      problems,
      [s.planNames[0]!, hostileCode("R1", 1, 1), hostileCode("R1", 10, 2)],
      "floor-plan-version",
    );
    await search(page, /^Search location code, aisle or rack run/, "</script>");
    await expectPlainText(
      page,
      problems,
      [hostileCode("R2", 11, 1), hostileCode("R2", 20, 2)],
      "floor-plan-version-r2",
    );
  });

  it("the items list", async () => {
    const { page, problems } = planner;
    await page.goto(`${APP_URL}/items`);
    await search(page, /^Search SKU, description or bin/, s.tag);
    await expectPlainText(page, problems, [...s.items.map((i) => i.sku), ...HOSTILE, "${7*7}"], "items");
  });

  it("the orders list", async () => {
    const { page, problems } = planner;
    await page.goto(`${APP_URL}/orders`);
    await page.getByLabel("Show").selectOption("all");
    await search(page, /^Search order, customer reference/, s.tag);
    await expectPlainText(
      page,
      problems,
      s.orders.map((o) => o.orderNumber),
      "orders",
    );
    await expectPlainText(page, problems, HOSTILE, "orders-customers");
  });

  it("the waves list, the wave with its short-pick list, a batch and its pick list", async () => {
    const { page, problems } = planner;
    await page.goto(`${APP_URL}/waves`);
    await expectPlainText(page, problems, [s.waveName], "waves");
    await page.goto(`${APP_URL}/waves/${s.waveId}`);
    await page.getByRole("heading", { name: /short/i }).first().waitFor();
    const short = page.locator("section[aria-labelledby=shorts-title]");
    const shortSku = (await short.locator("td.font-mono").nth(1).textContent())!;
    expect(s.items.map((i) => i.sku)).toContain(shortSku);
    await expectPlainText(page, problems, [s.waveName, shortSku], "wave");

    await page.goto(`${APP_URL}/waves/${s.waveId}/batches/1`);
    await expectPlainText(
      page,
      problems,
      [...s.items.map((i) => i.bin), ...s.items.map((i) => i.sku), ...s.orders.map((o) => o.orderNumber)],
      "batch",
    );

    await page.goto(`${APP_URL}/waves/${s.waveId}/batches/1/print`);
    await expectPlainText(
      page,
      problems,
      [
        s.waveName,
        ...s.items.map((i) => i.bin),
        ...s.items.map((i) => i.sku),
        ...HOSTILE,
        ...s.orders.map((o) => o.orderNumber),
        `Then take the cart to ${HOSTILE_DROPOFF} (P1).`,
      ],
      "pick-list",
    );
  });

  it("the handheld of a picker whose name is hostile", async () => {
    const { page, problems } = picker;
    await page.goto(`${APP_URL}/my-batches`);
    await expectPlainText(page, problems, [s.picker.displayName, s.waveName], "my-batches");
    await page.goto(`${APP_URL}/pick/${s.batchIds[0]}`);
    const location = page.getByTestId("stop-location");
    await location.waitFor();
    const code = (await location.textContent())!.trim();
    const item = s.items.find((i) => i.bin === code.replace(/\s*▲$/, ""));
    expect(item, `the stop shows one of our bin codes as it is: ${code}`).toBeDefined();
    await expectPlainText(page, problems, [item!.bin, item!.sku, item!.description], "handheld");
  });
});
