// axe-core run on a page's main content. The library goes in by
// page.evaluate, which the page's Content-Security-Policy does not govern; a
// script tag added to the page would be an inline script without the nonce.
import { readFileSync } from "node:fs";
import { createRequire } from "node:module";
import type { Page } from "@playwright/test";

const axeSource = readFileSync(createRequire(import.meta.url).resolve("axe-core/axe.min.js"), "utf8");

type Violation = { id: string; impact: string | null; nodes: { html: string }[] };
type Axe = { run: (context: unknown) => Promise<{ violations: Violation[] }> };

/** axe's violations in `main`, at the impacts given (all of them by default), one line each. */
export async function axeViolations(page: Page, impacts?: string[]): Promise<string[]> {
  await page.evaluate(axeSource);
  const violations = await page.evaluate(async () => (await (window as unknown as { axe: Axe }).axe.run("main")).violations);
  return violations
    .filter((violation) => !impacts || impacts.includes(violation.impact ?? ""))
    .map((violation) => `${violation.id} (${violation.impact}): ${violation.nodes.length} × ${violation.nodes[0]?.html.slice(0, 140)}`);
}
