import type { BrowserContext, Page } from "playwright-core";

export type PageProblems = { violations: string[]; console: string[]; errors: string[]; dialogs: string[] };

/**
 * Records, for every page of a context: CSP violations (a `securitypolicyviolation` listener put in
 * before any page script runs), console messages about the policy, uncaught script errors and
 * dialogs (alert/confirm/prompt are dismissed, so an injected alert(1) cannot hang the run).
 */
export async function watchProblems(context: BrowserContext): Promise<PageProblems> {
  const problems: PageProblems = { violations: [], console: [], errors: [], dialogs: [] };
  await context.exposeBinding("__reportCspViolation", (_source, text: string) => {
    problems.violations.push(text);
  });
  await context.addInitScript(() => {
    document.addEventListener("securitypolicyviolation", (e) => {
      const report = (window as unknown as { __reportCspViolation: (t: string) => void }).__reportCspViolation;
      report(
        `${e.violatedDirective} blocked ${e.blockedURI || "(inline)"} at ${e.sourceFile}:${e.lineNumber} on ${location.pathname}`,
      );
    });
  });
  const watch = (page: Page) => {
    page.on("console", (m) => {
      if (/content.security.policy|refused to (load|execute|apply|connect|frame)/i.test(m.text()))
        problems.console.push(`${m.type()}: ${m.text()}`);
    });
    page.on("pageerror", (e) => problems.errors.push(`${page.url()}: ${e.message}`));
    page.on("dialog", (d) => {
      problems.dialogs.push(`${d.type()}: ${d.message()}`);
      void d.dismiss();
    });
  };
  context.pages().forEach(watch);
  context.on("page", watch);
  return problems;
}

/** Forgets what was recorded so far, so each check sees only its own page's problems. */
export function clearProblems(problems: PageProblems) {
  for (const list of Object.values(problems)) list.length = 0;
}

/** True once React has hydrated the page: it keeps its fiber on every DOM node it took over. */
export async function isHydrated(page: Page, selector = "main"): Promise<boolean> {
  // Hydration of a long page (a wave's pick lists) can finish after the network went idle: wait for it.
  return page
    .waitForFunction(
      (sel) => {
        const el = document.querySelector(sel);
        return !!el && Object.keys(el).some((k) => k.startsWith("__reactFiber$"));
      },
      selector,
      { timeout: 15_000 },
    )
    .then(
      () => true,
      () => false,
    );
}
