// The probe's check of the headers every answer carries (scripts/probe/headers.ts),
// against answers written by hand as decision 010 describes them.
import { describe, expect, test } from "vitest";
import { expectedPagePolicy } from "../support/page-policy";
import { headerProblems, NOTHING_POLICY, type HeaderCheck } from "../../scripts/probe/headers";
import type { Answer } from "../../scripts/probe/http";

const SIGN_IN = "https://github.com";
const NONCE = "q1w2e3r4t5y6u7i8o9p0aA==";
const everyAnswer = {
  "x-content-type-options": ["nosniff"],
  "x-frame-options": ["DENY"],
  "referrer-policy": ["strict-origin-when-cross-origin"],
  "permissions-policy": ["camera=(), microphone=(), geolocation=(), usb=(), payment=(), serial=(self)"],
};

const answer = (headers: Record<string, string[]>, excerpt = ""): Answer => ({
  status: 200,
  reached: [],
  location: null,
  headers: { ...everyAnswer, ...headers },
  retryAfter: null,
  excerpt,
  error: null,
  ms: 1,
});
const check = (overrides: Partial<HeaderCheck> = {}): HeaderCheck => ({
  signInOrigin: SIGN_IN,
  personal: false,
  method: "GET",
  nonces: new Set(),
  ...overrides,
});
const page = (nonce = NONCE, extra: Record<string, string[]> = {}) =>
  answer({ "content-security-policy": [expectedPagePolicy(nonce, SIGN_IN)], "content-type": ["text/html"], ...extra }, "<!DOCTYPE html><script nonce>");

describe("the headers every answer carries", () => {
  test("a page with its policy and a JSON answer with the policy that loads nothing pass", () => {
    expect(headerProblems(page(), check())).toEqual([]);
    expect(headerProblems(answer({ "content-security-policy": [NOTHING_POLICY], "content-type": ["application/json"] }), check())).toEqual([]);
  });

  test("a header sent twice is named (table downloads once sent nosniff twice)", () => {
    const twice = answer({ "content-security-policy": [NOTHING_POLICY], "x-content-type-options": ["nosniff", "nosniff"] });
    expect(headerProblems(twice, check())).toEqual(["x-content-type-options sent 2 times"]);
  });

  test("a missing helmet header, a feature left on and a missing policy are each named", () => {
    const bare = answer({ "x-frame-options": [], "permissions-policy": ["camera=(), serial=(self)"] });
    const problems = headerProblems(bare, check());
    expect(problems).toContain("x-frame-options: null, not DENY");
    expect(problems).toContain("permissions-policy does not turn microphone off");
    expect(problems).toContain("no content-security-policy");
  });

  test("a nonce may not come twice, nor be shorter than 128 bits", () => {
    const nonces = new Set<string>();
    expect(headerProblems(page(), check({ nonces }))).toEqual([]);
    expect(headerProblems(page(), check({ nonces }))).toEqual([`nonce ${NONCE} came before`]);
    expect(headerProblems(page("short"), check()).join("\n")).toMatch(/is neither the page policy nor/);
  });

  test("a signed-in person's page must be private, no-store; someone else's need not", () => {
    expect(headerProblems(page(), check({ personal: true }))).toEqual(["cache-control null on a signed-in person's page"]);
    expect(headerProblems(page(NONCE, { "cache-control": ["private, no-store"] }), check({ personal: true }))).toEqual([]);
  });

  test("an HTML page with scripts under the policy that loads nothing is named", () => {
    const broken = answer({ "content-security-policy": [NOTHING_POLICY], "content-type": ["text/html"] }, "<!DOCTYPE html><html><script src=x>");
    expect(headerProblems(broken, check())).toEqual(["an HTML page with scripts under the policy that loads nothing"]);
  });
});
