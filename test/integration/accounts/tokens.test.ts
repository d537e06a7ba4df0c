import { beforeAll, beforeEach, describe, expect, test } from "vitest";
import { seedDemo } from "../../../db/seed";
import { bearer, demoIds, memberAs, outcome, refusal as refusalOf, type ApiRefusal, type DemoIds } from "../../support/routes";
import { type Member, requireApiAccess } from "~/platform/access.server";
import { database } from "~/platform/db.server";
import { resetRateLimits } from "~/platform/rate-limit.server";
import { createToken, listTokens, revokeToken } from "~/features/accounts/tokens.server";
import { apiTokens } from "../../../db/schema";
import { eq } from "drizzle-orm";
import { createWorkspace } from "~/features/accounts/workspaces.server";
import { loader as apiWorkspace } from "~/routes/api.v1/workspace";

let ids: DemoIds;
let firmware: Member;

const withToken = (token: string) => bearer("/api/v1/workspace", token);

beforeAll(async () => {
  await seedDemo(database());
  ids = await demoIds(database());
  firmware = await memberAs("firmware", ids);
});
beforeEach(() => resetRateLimits());

describe("API tokens", () => {
  test("a new token works with the holder's role, is stored only as a hash, and shows its last use", async () => {
    const { token, row } = await createToken(firmware, "build server");
    expect(token).toMatch(/^gl_[A-Za-z0-9_-]{43}$/);
    const response = (await apiWorkspace({ request: withToken(token), params: {}, context: {} } as never)) as Response;
    expect(response.status).toBe(200);
    expect(await response.json()).toMatchObject({ role: "firmware", via: "token", workspace: { id: ids.workspaceId } });
    const [listed] = (await listTokens(firmware)).filter((t) => t.id === row.id);
    expect(listed.prefix).toBe(token.slice(0, 9));
    expect(listed.lastUsedAt).not.toBeNull();
    const stored = await database().execute(`select token_hash from api_tokens where id = '${row.id}'`);
    expect(JSON.stringify(stored)).not.toContain(token);
  });

  test("a revoked token is refused with 401", async () => {
    const { token, row } = await createToken(firmware, "to revoke");
    await revokeToken(firmware, row.id);
    const refusal = await outcome<ApiRefusal>(() => requireApiAccess(withToken(token), "workspace.read"));
    expect(refusal.status).toBe(401);
    expect(refusal.body.error.code).toBe("unauthorized");
  });

  test("a token of another workspace does not reach this one", async () => {
    const owner = await memberAs("owner", ids);
    const other = await createWorkspace(owner.user, "Driftwood Test Lab");
    const { token } = await createToken({ ...owner, workspace: other, role: "owner" }, "other lab");
    const member = await requireApiAccess(withToken(token), "workspace.read");
    expect(member.workspace.id).toBe(other.id);
    expect(member.workspace.id).not.toBe(ids.workspaceId);
  });

  test("a token stops working when its holder's role no longer allows tokens", async () => {
    const viewer = await memberAs("viewer", ids);
    // Made while the holder was allowed, then the role changed.
    const { token } = await createToken({ ...viewer, role: "firmware" }, "was firmware");
    const refusal = await outcome<ApiRefusal>(() => requireApiAccess(withToken(token), "workspace.read"));
    expect(refusal.status).toBe(401);
  });

  test("a malformed Authorization header gets a 401 that says how to send the token", async () => {
    const refusal = await outcome<ApiRefusal>(() =>
      requireApiAccess(new Request("http://127.0.0.1:3000/api/v1/workspace", { headers: { Authorization: "Token abc" } }), "workspace.read"),
    );
    expect(refusal.status).toBe(401);
    expect(refusal.body.error.message).toContain("Bearer <token>");
  });

  test("each token has a rate limit: past it, 429 with Retry-After", async () => {
    const { token } = await createToken(firmware, "busy script");
    for (let i = 0; i < 120; i++) await requireApiAccess(withToken(token), "workspace.read");
    const refusal = await outcome<ApiRefusal>(() => requireApiAccess(withToken(token), "workspace.read"));
    expect(refusal.status).toBe(429);
    expect(Number(refusal.headers.get("Retry-After"))).toBeGreaterThan(0);
    expect(refusal.body.error.code).toBe("rate_limited");
  });

  test("a token acts within its role: firmware cannot approve versions", async () => {
    const { token } = await createToken(firmware, "limited");
    const refusal = await outcome<ApiRefusal>(() => requireApiAccess(withToken(token), "versions.decide"));
    expect(refusal.status).toBe(403);
    expect(refusal.body.error.message).toBe("The firmware role cannot approve or send back versions.");
  });

  test("a token may expire: the holder picks 7, 30, 90 or 365 days at creation, or none; the list shows when", async () => {
    const before = Date.now();
    const { row } = await createToken(firmware, "for a month", 30);
    const [listed] = (await listTokens(firmware)).filter((t) => t.id === row.id);
    expect(listed.expiresAt!.getTime() - before).toBeGreaterThanOrEqual(30 * 86_400_000 - 1_000);
    expect(listed.expiresAt!.getTime() - before).toBeLessThan(30 * 86_400_000 + 60_000);
    const { row: forever } = await createToken(firmware, "no end", null);
    expect(forever.expiresAt).toBeNull();
    const refused = await refusalOf(() => createToken(firmware, "too long", 1000));
    expect(refused).toMatchObject({
      status: 422,
      message: "Choose how long the token lasts: 7, 30, 90 or 365 days, or no expiry.",
      details: { field: "expires" },
    });
  });

  test("an expired token answers 401 with a message that says it expired, and when", async () => {
    const { token, row } = await createToken(firmware, "short-lived", 7);
    const expiredAt = new Date("2026-01-02T03:04:00Z");
    await database().update(apiTokens).set({ expiresAt: expiredAt }).where(eq(apiTokens.id, row.id));
    const refusal = await outcome<ApiRefusal>(() => requireApiAccess(withToken(token), "workspace.read"));
    expect(refusal.status).toBe(401);
    expect(refusal.body.error).toEqual({
      code: "unauthorized",
      message: "This API token (short-lived) expired at 2026-01-02 03:04 UTC; create a new one in Settings → API tokens.",
    });
  });
});
