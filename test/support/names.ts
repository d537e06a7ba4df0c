// Names for the rows a test adds. Each test file has a database of its own,
// but the fake mail inbox is shared by every worker, so a name carries the
// time, the worker and a counter: no other test, worker or run makes it.
let counter = 0;

/**
 * `label` with a stamp no other test uses, joined by hyphens so the name also
 * serves as a login, a slug or the local part of an e-mail address.
 */
export const uniqueName = (label: string): string => `${label}-${Date.now().toString(36)}-${process.env.VITEST_POOL_ID ?? 0}-${++counter}`;
