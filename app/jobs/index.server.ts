// Every queue the job runner works. A feature with background work defines a
// JobDefinition beside its services (app/platform/jobs.server.ts has the type),
// sends jobs with enqueueJob inside its transactions, and adds the definition here.
import type { JobDefinition } from "../platform/jobs.server";
import { mailDelivery } from "../platform/outbox.server";

// Each definition's data type is its own; the runner only passes it through.
// eslint-disable-next-line @typescript-eslint/no-explicit-any -- a list of definitions of different job data
export const JOBS: readonly JobDefinition<any>[] = [mailDelivery];
