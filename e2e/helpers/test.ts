import { test as base, expect, type BrowserContext, type Page } from "@playwright/test";

// Every spec imports `test` and `expect` from here, not from @playwright/test: every page of the
// test (the default context and any context a spec opens with browser.newContext/newPage) reports
// Content-Security-Policy violations, through the browser's own `securitypolicyviolation` event and
// its console messages, and the test fails if any came in. The app runs with its real policy
// (proxy.ts), so a script, style or font the policy refuses fails the browser tests instead of
// silently breaking a screen. Contexts a test opens are closed when it ends.

const REPORT = "[csp-violation]";
const CSP_TEXT = /Content[- ]Security[- ]Policy/i;

export const test = base.extend<{ cspViolations: string[] }>({
  cspViolations: [
    async ({ context, browser }, runTest) => {
      const violations: string[] = [];
      const watchPage = (page: Page) => {
        page.on("console", (message) => {
          const text = message.text();
          if (text.startsWith(REPORT) || CSP_TEXT.test(text)) violations.push(`${page.url()}: ${text}`);
        });
        page.on("pageerror", (error) => {
          if (CSP_TEXT.test(error.message)) violations.push(`${page.url()}: ${error.message}`);
        });
      };
      const instrument = async (ctx: BrowserContext) => {
        await ctx.addInitScript((prefix: string) => {
          document.addEventListener("securitypolicyviolation", (e) => {
            console.error(
              `${prefix} ${e.effectiveDirective} refused ${e.blockedURI || "inline"} at ${e.sourceFile}:${e.lineNumber}`,
            );
          });
        }, REPORT);
        ctx.pages().forEach(watchPage);
        ctx.on("page", watchPage);
      };
      await instrument(context);
      const newContext = browser.newContext;
      const opened: BrowserContext[] = [];
      browser.newContext = async (...args: Parameters<typeof newContext>) => {
        const ctx = await newContext.apply(browser, args);
        opened.push(ctx);
        await instrument(ctx);
        return ctx;
      };
      try {
        await runTest(violations);
      } finally {
        browser.newContext = newContext;
        // A context the test opened and did not close (it failed first, or it forgot) would keep
        // its pages polling the app through the later tests: close them all here.
        await Promise.all(opened.map((ctx) => ctx.close().catch(() => undefined)));
      }
      expect(violations, "Content-Security-Policy violations in the browser console").toEqual([]);
    },
    { auto: true },
  ],
});

export { expect };
export type { APIRequestContext, Browser, Page } from "@playwright/test";
