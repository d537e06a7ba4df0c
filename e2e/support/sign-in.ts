// Signs in through the local GitHub stand-in, as a person would.
import { expect, type Page } from "@playwright/test";
import { demoPeople } from "../../db/demo/scenario";

export async function signInAs(page: Page, login: string, returnTo = "/"): Promise<void> {
  await page.goto(`/sign-in?returnTo=${encodeURIComponent(returnTo)}`);
  await page.getByRole("button", { name: "Sign in with GitHub" }).click();
  await expect(page.getByRole("heading", { name: "Local sign-in" })).toBeVisible();
  const demo = demoPeople.find((person) => person.login === login);
  if (demo) {
    await page.getByRole("button", { name: new RegExp(`^Continue as ${demo.name}`) }).click();
  } else {
    throw new Error(`${login} is not a demo person; use signInAsNewPerson`);
  }
  await expect(page.getByLabel("Your account")).toBeVisible();
}

/** Someone who has never used Gaitloom, typed into the stand-in's form; their address is verified unless `verified` is false. */
export async function signInAsNewPerson(page: Page, person: { login: string; name: string; email: string; verified?: boolean }, returnTo = "/") {
  await page.goto(`/sign-in?returnTo=${encodeURIComponent(returnTo)}`);
  await page.getByRole("button", { name: "Sign in with GitHub" }).click();
  await page.getByLabel("Login").fill(person.login);
  await page.getByLabel("Name").fill(person.name);
  await page.getByLabel("E-mail").fill(person.email);
  if (person.verified === false) await page.getByLabel("Leave this address unverified").check();
  await page.getByRole("button", { name: "Continue as this person" }).click();
}

export const MAIL_API = process.env.MAIL_INBOX_URL ?? "http://127.0.0.1:2626";

/** The newest message the local SMTP stand-in received for `to`, waiting for it to arrive. */
export async function latestMailTo(to: string, timeoutMs = 7_000): Promise<{ subject: string; text: string }> {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    const response = await fetch(`${MAIL_API}/messages?to=${encodeURIComponent(to)}`);
    const messages = (await response.json()) as { subject: string; text: string }[];
    if (messages.length > 0) return messages[0];
    await new Promise((resolve) => setTimeout(resolve, 200));
  }
  throw new Error(`no mail for ${to} within ${timeoutMs} ms`);
}
