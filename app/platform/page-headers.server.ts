// What a page answer (the HTML of a page and the data of its client-side
// navigations) says about itself that depends on the page: its
// Content-Security-Policy, naming a nonce made for this answer alone, and,
// for a signed-in person, that no cache may keep it. app/entry.server.tsx
// applies it; the headers that are the same for every answer, and the policy
// of everything that is not a page, are server.js's (docs/decisions/010-headers.md).
import { randomBytes } from "node:crypto";
import { config } from "./config.server";
import { readSession } from "./session.server";

/** A nonce for one answer: 128 random bits, base64 (CSP Level 3, §7.1: at least 128 bits, unguessable). */
export function newNonce(): string {
  return randomBytes(16).toString("base64");
}

/**
 * The page's policy: scripts and styles from our own origin, the scripts the
 * page renders inline (the framework's hydration data, the root's zod
 * setting) by this answer's nonce, and style attributes, which the
 * components set. Forms post to our
 * own origin and to GitHub's sign-in: the sign-in form's answer is a
 * redirect there, and Chromium checks form-action along redirects too.
 *
 * Under `react-router dev` (NODE_ENV=development) styles may be inline as
 * well: Vite puts each stylesheet into a <style> element of its own for hot
 * reloading. The built app never runs that way.
 */
export function pagePolicy(nonce: string): string {
  const development = process.env.NODE_ENV === "development";
  const signInOrigin = new URL(config().github.oauthUrl).origin;
  return [
    "default-src 'self'",
    `script-src 'self' 'nonce-${nonce}'`,
    development ? "style-src 'self' 'unsafe-inline'" : "style-src 'self'",
    "style-src-attr 'unsafe-inline'",
    "img-src 'self' data:",
    "object-src 'none'",
    "base-uri 'self'",
    `form-action 'self' ${signInOrigin}`,
    "frame-ancestors 'none'",
  ].join("; ");
}

/**
 * Marks a page answer to a signed-in person as theirs alone and not to be
 * kept, by a shared cache or by the browser (nor shown again from its cache
 * after they signed out). Pages for no one in particular keep the default.
 */
export async function markPersonal(request: Request, headers: Headers): Promise<void> {
  const session = await readSession(request);
  if (session.has("userId")) headers.set("Cache-Control", "private, no-store");
}
