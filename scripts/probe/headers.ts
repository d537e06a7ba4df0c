// The headers every answer must carry (docs/decisions/010-headers.md), checked
// on each answer the probe gets: helmet's and our Permissions-Policy on all;
// a page its own policy with a fresh 128-bit nonce, and `private, no-store`
// when it is for a signed-in person; anything else a policy that loads nothing.
import { expectedPagePolicy } from "../../test/support/page-policy";
import type { Answer } from "./http";

export const NOTHING_POLICY = "default-src 'none'; frame-ancestors 'none'";

const EVERY_ANSWER: [string, string][] = [
  ["x-content-type-options", "nosniff"],
  ["x-frame-options", "DENY"],
  ["referrer-policy", "strict-origin-when-cross-origin"],
];
const FEATURES_OFF = ["camera", "microphone", "geolocation", "usb", "payment"];
// 128 bits in base64 (with or without padding, either alphabet): at least 22 characters.
const NONCE = /'nonce-([A-Za-z0-9+/_-]{22,}={0,2})'/;

export type HeaderCheck = {
  /** The GitHub sign-in origin the page policy's form-action names. */
  signInOrigin: string;
  /** The request carried a live session: a page or its data must be `private, no-store`. */
  personal: boolean;
  /** The request's method: an answer to HEAD has no body and needs no Content-Type. */
  method: string;
  /** Nonces seen so far: none may come twice. */
  nonces: Set<string>;
};

/** What is wrong with `answer`'s headers, one line each; empty when nothing. */
export function headerProblems(answer: Answer, check: HeaderCheck): string[] {
  const problems: string[] = [];
  const one = (name: string) => {
    const values = answer.headers[name] ?? [];
    if (values.length > 1) problems.push(`${name} sent ${values.length} times`);
    return values[0];
  };
  for (const [name, value] of EVERY_ANSWER) if (one(name) !== value) problems.push(`${name}: ${JSON.stringify(one(name) ?? null)}, not ${value}`);
  const permissions = (one("permissions-policy") ?? "").split(/,\s*/);
  for (const feature of FEATURES_OFF) if (!permissions.includes(`${feature}=()`)) problems.push(`permissions-policy does not turn ${feature} off`);
  if (!permissions.includes("serial=(self)")) problems.push("permissions-policy does not keep serial=(self)");

  const policy = one("content-security-policy");
  const nonce = policy ? NONCE.exec(policy)?.[1] : undefined;
  const isPage = nonce !== undefined;
  if (policy === undefined) problems.push("no content-security-policy");
  else if (isPage && policy !== expectedPagePolicy(nonce, check.signInOrigin)) problems.push(`a page policy other than decision 010's: ${policy}`);
  else if (!isPage && policy !== NOTHING_POLICY)
    problems.push(`content-security-policy ${JSON.stringify(policy)} is neither the page policy nor "${NOTHING_POLICY}"`);
  if (isPage) {
    if (check.nonces.has(nonce)) problems.push(`nonce ${nonce} came before`);
    check.nonces.add(nonce);
    if (check.method !== "HEAD" && !/^text\/html\b/.test(one("content-type") ?? ""))
      problems.push(`the page policy on a ${one("content-type") ?? "typeless"} answer`);
  } else if (/^<!doctype html>[\s\S]*<script\b/i.test(answer.excerpt)) {
    problems.push("an HTML page with scripts under the policy that loads nothing");
  }
  const isData = /^text\/x-script\b/.test(one("content-type") ?? "");
  if (check.personal && (isPage || isData) && answer.status !== null && answer.status < 300 && one("cache-control") !== "private, no-store") {
    problems.push(`cache-control ${JSON.stringify(one("cache-control") ?? null)} on a signed-in person's ${isPage ? "page" : "page data"}`);
  }
  return problems;
}
