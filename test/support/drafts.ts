// Gait drafts as tests need them: a draft that differs from every version,
// since a commit of content equal to the newest version's is refused.
import { eq, sql } from "drizzle-orm";
import type { Database } from "../../db/client";
import { gaits } from "../../db/schema";
import { uniqueName } from "./names";

/**
 * Gives the gait's draft a description no version has (and the next draft
 * revision, as a save does), so that committing it makes a new version.
 */
export async function changeDraft(db: Database, gaitId: string): Promise<void> {
  await db
    .update(gaits)
    .set({
      draftSequence: sql`jsonb_set(${gaits.draftSequence}, '{description}', to_jsonb(${uniqueName("Changed draft")}::text))`,
      draftRevision: sql`${gaits.draftRevision} + 1`,
    })
    .where(eq(gaits.id, gaitId));
}
