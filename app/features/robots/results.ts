// What the robot actions answer, shared by the route modules and the components that show it.
import type { DefinitionIssue } from "~/kinematics";
import type { FormError } from "~/platform/errors";

/** A saved revision (a save or a restore). */
export type SavedRevision = { ok: true; number: number; message: string };

/** What a refused save carries: the issues by path, or for `stale` the revision the form started from and the newest one now. */
export type SaveRefusalDetails = {
  issues?: DefinitionIssue[];
  baseRevision?: number;
  latest?: { number: number; authorName: string | null; createdAt: string; message: string };
};

export type SaveResult = SavedRevision | FormError<SaveRefusalDetails>;

/** A robot imported from URDF, with what was mapped; the other ways to add a robot open it at once. */
export type ImportedRobot = { ok: true; robotId: string; name: string; report: string[] };

/** What a refused addition carries: the issues by path, and the URDF importer's report when it got that far. */
export type AddRefusalDetails = { issues?: DefinitionIssue[]; report?: string[] };

export type AddResult = ImportedRobot | FormError<AddRefusalDetails>;
