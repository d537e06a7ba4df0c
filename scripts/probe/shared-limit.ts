// The rate limit two app processes share (docs/decisions/009-rate-limits-in-postgresql.md):
// one token's calls spread over both, twice its allowance within a minute,
// must be answered 200 for exactly the allowance and 429 with Retry-After
// for the rest, the refusals carrying the same headers as every answer.
import { headerProblems } from "./headers";
import { makeAgent, send, type Answer } from "./http";

/** Calls a minute one API token may make (decision 009, DESIGN.md's API section). */
export const TOKEN_CALLS_A_MINUTE = 120;

export type SharedLimitResult = { sent: number; answered200: number; refused429: number; problems: string[] };

export async function probeSharedLimit(apps: URL[], token: string, signInOrigin: string): Promise<SharedLimitResult> {
  const agent = makeAgent(8);
  const answers: Answer[] = [];
  const calls = 2 * TOKEN_CALLS_A_MINUTE;
  let next = 0;
  const worker = async () => {
    while (next < calls) {
      const app = apps[next++ % apps.length];
      answers.push(await send(app, { method: "GET", path: "/api/v1/workspace", headers: { Authorization: `Bearer ${token}` } }, agent, 30_000));
    }
  };
  await Promise.all(Array.from({ length: 8 }, worker));
  agent.destroy();

  const problems: string[] = [];
  const nonces = new Set<string>();
  const answered200 = answers.filter((answer) => answer.status === 200).length;
  const refused = answers.filter((answer) => answer.status === 429);
  const other = answers.filter((answer) => answer.status !== 200 && answer.status !== 429);
  if (answered200 !== TOKEN_CALLS_A_MINUTE) problems.push(`${answered200} calls answered 200, not ${TOKEN_CALLS_A_MINUTE}`);
  if (other.length) problems.push(`${other.length} answered otherwise: ${[...new Set(other.map((answer) => answer.status ?? answer.error))].join(", ")}`);
  for (const answer of refused) {
    if (!answer.retryAfter || !/^\d+$/.test(answer.retryAfter)) problems.push(`a 429 without a Retry-After in seconds (${JSON.stringify(answer.retryAfter)})`);
    if (!answer.excerpt.includes('"rate_limited"')) problems.push(`a 429 whose body is not the rate_limited error: ${answer.excerpt.slice(0, 120)}`);
  }
  for (const answer of answers) problems.push(...headerProblems(answer, { signInOrigin, personal: false, method: "GET", nonces }));
  return { sent: answers.length, answered200, refused429: refused.length, problems: [...new Set(problems)] };
}
