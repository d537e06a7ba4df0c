// The `test` and `expect` every spec imports: Playwright's, with each browser
// context a test opens (its own page, and any from browser.newContext or
// browser.newPage) listening for Content-Security-Policy violations, so a
// test fails when a page it drove reported one. The listener is an init
// script, which the browser runs before the page's own and outside its
// policy; in a context with JavaScript off, Chromium's console line for the
// refusal is heard instead.
import { test as base, type Browser, type BrowserContext } from "@playwright/test";

export { expect } from "@playwright/test";
export type { APIResponse, Locator, Page } from "@playwright/test";

const REPORT = "__gaitloomCspViolation";
/**
 * Makes `context` add each violation its pages report to `heard`: from the
 * init script's listener, or, with JavaScript off, from Chromium's console
 * line for the refusal.
 */
async function listen(context: BrowserContext, heard: string[], javaScript = true) {
  if (!javaScript) {
    context.on("console", (message) => {
      if (/Content Security Policy/.test(message.text())) heard.push(`${message.text()} (${message.page()?.url() ?? "a page"})`);
    });
    return;
  }
  await context.exposeBinding(REPORT, ({ page }, violation: string) => void heard.push(`${violation} (${page?.url() ?? "a page"})`));
  await context.addInitScript((report) => {
    document.addEventListener(
      "securitypolicyviolation",
      (event) => {
        const where = event.sourceFile ? ` at ${event.sourceFile}:${event.lineNumber}` : "";
        const call = (window as unknown as Record<string, (violation: string) => void>)[report];
        call(`${event.effectiveDirective} refused ${event.blockedURI}${where}`);
      },
      true,
    );
  }, REPORT);
}

export const test = base.extend<{ cspViolations: string[] }>({
  /** The violations reported so far in this test; a test that provokes one on purpose empties it. */
  cspViolations: [
    async ({ browser, javaScriptEnabled }, use) => {
      const heard: string[] = [];
      const newContext = browser.newContext;
      // Set up before the test's own context (auto fixtures come first), which opens through newContext
      // as browser.newPage does; test.use's options reach contexts a test opens itself too.
      browser.newContext = async function (this: Browser, ...args: Parameters<Browser["newContext"]>) {
        const context = await newContext.apply(this, args);
        await listen(context, heard, (args[0]?.javaScriptEnabled ?? javaScriptEnabled) !== false);
        return context;
      };
      await use(heard);
      browser.newContext = newContext;
      base.expect(heard, "Content-Security-Policy violations reported by the pages").toEqual([]);
    },
    { auto: true },
  ],
});
