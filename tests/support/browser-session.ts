import type { Browser, BrowserContext, Page } from "playwright-core";
import { APP_URL, demoAccount } from "./app";
import type { Role } from "@/lib/auth/permissions";

/** Signs `page` in as a demo role through the sign-in page; the caller waits for where it lands. */
export async function signInOnPage(page: Page, role: Role): Promise<void> {
  const a = demoAccount(role);
  await page.goto(`${APP_URL}/sign-in`);
  await page.getByLabel("E-mail address").fill(a.email);
  await page.getByLabel("Password").fill(a.password);
  await page.getByRole("button", { name: "Sign in" }).click();
}

/** A browser context signed in as a demo role through the sign-in page. */
export async function signedInPage(
  browser: Browser,
  role: Role,
  viewport = { width: 1280, height: 900 },
): Promise<{ context: BrowserContext; page: Page }> {
  const context = await browser.newContext({ viewport });
  const page = await context.newPage();
  await signInOnPage(page, role);
  await page.waitForURL((u) => !u.pathname.startsWith("/sign-in"));
  return { context, page };
}
