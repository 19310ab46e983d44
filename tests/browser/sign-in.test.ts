import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser } from "playwright-core";
import http from "node:http";
import type { AddressInfo } from "node:net";
import path from "node:path";
import { APP_URL, demoAccount } from "../support/app";
import { ARTIFACTS, launchBrowser } from "../support/browser";
import { signInOnPage } from "../support/browser-session";
import { ROLE_HOME, ROLES } from "@/lib/auth/permissions";

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

const HOME_HEADING = {
  admin: "Floor plans",
  planner: "Waves",
  picker: "My batches",
  supervisor: "Shift floor",
} as const;

describe("signing in through the browser", () => {
  for (const role of ROLES) {
    it(`${role} lands on their own start page`, async () => {
      // The picker works on a phone-sized handheld; the others at a desk.
      const viewport = role === "picker" ? { width: 390, height: 844 } : { width: 1280, height: 800 };
      const context = await browser.newContext({ viewport });
      const page = await context.newPage();
      await page.goto(`${APP_URL}/`);
      await page.waitForURL(/\/sign-in/);
      const a = demoAccount(role);
      await page.getByLabel("E-mail address").fill(a.email);
      await page.getByLabel("Password").fill(a.password);
      await page.getByRole("button", { name: "Sign in" }).click();
      await page.waitForURL((u) => u.pathname === ROLE_HOME[role]);
      await expect(page.getByRole("heading", { level: 1 }).textContent()).resolves.toBe(HOME_HEADING[role]);
      await expect(page.getByText(a.displayName).first().isVisible()).resolves.toBe(true);
      await page.screenshot({ path: path.join(ARTIFACTS, `home-${role}.png`), fullPage: true });
      await context.close();
    });
  }

  it("a wrong password shows the message on the form", async () => {
    const context = await browser.newContext();
    const page = await context.newPage();
    await page.goto(`${APP_URL}/sign-in`);
    await page.getByLabel("E-mail address").fill("nobody@tests.example");
    await page.getByLabel("Password").fill("wrong password");
    await page.getByRole("button", { name: "Sign in" }).click();
    // Next's route announcer is also an alert, so look for ours by what it says.
    const alert = page.getByRole("alert").filter({ hasText: /do not match/ });
    await alert.waitFor();
    await expect(alert.textContent()).resolves.toMatch(/Check both and try again/);
    await page.screenshot({ path: path.join(ARTIFACTS, "sign-in-error.png") });
    await context.close();
  });

  // A page on another origin stands in for a phishing site, so a redirect there is seen, not guessed.
  for (const [what, sep] of [
    ["a tab", "%09"],
    ["a newline", "%0a"],
    ["a backslash", "%5C"],
  ] as const) {
    it(`?next= with ${what} after the first slash still lands on this site`, async () => {
      const phish = http.createServer((_req, res) => res.end("<h1>phish</h1>"));
      await new Promise<void>((r) => phish.listen(0, "127.0.0.1", r));
      const phishHost = `127.0.0.1:${(phish.address() as AddressInfo).port}`;
      const context = await browser.newContext();
      const page = await context.newPage();
      try {
        await page.goto(`${APP_URL}/sign-in?next=/${sep}/${phishHost}/phish`);
        const a = demoAccount("planner");
        await page.getByLabel("E-mail address").fill(a.email);
        await page.getByLabel("Password").fill(a.password);
        await page.getByRole("button", { name: "Sign in" }).click();
        await page.waitForURL((u) => !u.pathname.startsWith("/sign-in") || u.host !== new URL(APP_URL).host);
        expect(new URL(page.url()).origin).toBe(new URL(APP_URL).origin);
        expect(new URL(page.url()).pathname).toBe(ROLE_HOME.planner);
      } finally {
        await context.close();
        phish.closeAllConnections();
        await new Promise<void>((r) => phish.close(() => r()));
      }
    });
  }

  it("the admin sees the users table and sign-out ends the session", async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const page = await context.newPage();
    await signInOnPage(page, "admin");
    await page.waitForURL(/\/floor-plans/);
    await page.getByRole("link", { name: "Users" }).click();
    await page.waitForURL(/\/admin\/users/);
    // The table fills in after SWR's first fetch.
    await page.getByRole("cell", { name: demoAccount("picker").email }).waitFor();
    await expect(page.getByRole("columnheader").allTextContents()).resolves.toEqual(
      expect.arrayContaining([expect.stringContaining("Role")]),
    );
    await page.screenshot({ path: path.join(ARTIFACTS, "admin-users.png"), fullPage: true });
    await page.getByRole("button", { name: "Sign out" }).click();
    await page.waitForURL(/\/sign-in/);
    await page.goto(`${APP_URL}/admin/users`);
    await page.waitForURL(/\/sign-in/);
    await context.close();
  });
});
