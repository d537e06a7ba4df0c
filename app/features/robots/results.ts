// What the robot actions answer, shared by the route modules and the components that show it.
import type { DefinitionIssue } from "~/kinematics";

export type SaveFailureCode = "bad-request" | "too-large" | "invalid" | "forbidden" | "not-found" | "stale" | "unchanged" | "name-taken";

export type SaveResult =
  | { ok: true; number: number; message: string }
  | {
      ok: false;
      code: SaveFailureCode;
      message: string;
      issues?: DefinitionIssue[];
      /** For "stale": the revision the form started from and the newest one now. */
      baseRevision?: number;
      latest?: { number: number; authorName: string | null; createdAt: string; message: string };
    };

export type AddIntent = "create" | "upload" | "import-urdf";

export type AddResult =
  | { ok: true; intent: "import-urdf"; robotId: string; name: string; report: string[] }
  | { ok: false; intent: AddIntent | null; message: string; issues?: DefinitionIssue[]; report?: string[] };
