// Personal API tokens: `gl_` + 32 random bytes, shown once, stored as SHA-256,
// with an optional expiry chosen at creation (past it the token answers 401).
import { randomBytes } from "node:crypto";
import { and, desc, eq, isNull } from "drizzle-orm";
import { apiTokens } from "../../../db/schema";
import { hashToken, type Member } from "../../platform/access.server";
import { recordAudit } from "../../platform/audit.server";
import { database } from "../../platform/db.server";
import { ServiceError } from "../../platform/errors.server";

export type TokenRow = {
  id: string;
  name: string;
  prefix: string;
  createdAt: Date;
  lastUsedAt: Date | null;
  revokedAt: Date | null;
  expiresAt: Date | null;
};

/** How long a new token may last, in days; null: it does not expire. */
export const TOKEN_LIFETIMES_DAYS = [7, 30, 90, 365] as const;

export async function listTokens(member: Member): Promise<TokenRow[]> {
  return database()
    .select({
      id: apiTokens.id,
      name: apiTokens.name,
      prefix: apiTokens.prefix,
      createdAt: apiTokens.createdAt,
      lastUsedAt: apiTokens.lastUsedAt,
      revokedAt: apiTokens.revokedAt,
      expiresAt: apiTokens.expiresAt,
    })
    .from(apiTokens)
    .where(and(eq(apiTokens.userId, member.user.id), eq(apiTokens.workspaceId, member.workspace.id)))
    .orderBy(desc(apiTokens.createdAt));
}

export async function createToken(member: Member, name: string, expiresInDays: number | null = null): Promise<{ token: string; row: TokenRow }> {
  const trimmed = name.trim();
  if (trimmed.length < 1 || trimmed.length > 60) throw new ServiceError(422, "invalid", "Give the token a name of 1 to 60 characters.", { field: "name" });
  if (expiresInDays !== null && !(TOKEN_LIFETIMES_DAYS as readonly number[]).includes(expiresInDays)) {
    throw new ServiceError(
      422,
      "invalid",
      `Choose how long the token lasts: ${TOKEN_LIFETIMES_DAYS.slice(0, -1).join(", ")} or ${TOKEN_LIFETIMES_DAYS.at(-1)} days, or no expiry.`,
      {
        field: "expires",
      },
    );
  }
  const expiresAt = expiresInDays === null ? null : new Date(Date.now() + expiresInDays * 86_400_000);
  const token = `gl_${randomBytes(32).toString("base64url")}`;
  return database().transaction(async (tx) => {
    const [row] = await tx
      .insert(apiTokens)
      .values({ workspaceId: member.workspace.id, userId: member.user.id, name: trimmed, tokenHash: hashToken(token), prefix: token.slice(0, 9), expiresAt })
      .returning();
    await recordAudit(
      {
        workspaceId: member.workspace.id,
        actorId: member.user.id,
        action: "token.created",
        targetType: "token",
        targetId: row.id,
        details: { name: trimmed, expiresAt: expiresAt?.toISOString() ?? null },
      },
      tx,
    );
    return { token, row };
  });
}

export async function revokeToken(member: Member, tokenId: string): Promise<void> {
  await database().transaction(async (tx) => {
    const [row] = await tx
      .update(apiTokens)
      .set({ revokedAt: new Date() })
      .where(and(eq(apiTokens.id, tokenId), eq(apiTokens.userId, member.user.id), eq(apiTokens.workspaceId, member.workspace.id), isNull(apiTokens.revokedAt)))
      .returning();
    if (!row) throw new ServiceError(404, "not-found", "No active token of yours with that id.");
    await recordAudit(
      {
        workspaceId: member.workspace.id,
        actorId: member.user.id,
        action: "token.revoked",
        targetType: "token",
        targetId: row.id,
        details: { name: row.name },
      },
      tx,
    );
  });
}
