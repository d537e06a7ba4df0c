// Gait pages (version-routes), spread into app/routes.ts under the `gaits` prefix inside the shell.
// Static segments (`compare`, the editor's `new`) outrank `:gaitId` whatever the order here.
import { route, type RouteConfigEntry } from "@react-router/dev/routes";

export const versionPages: RouteConfigEntry[] = [
  // two versions side by side (?a=<versionId>&b=<versionId>), or the picker
  route("compare", "routes/gaits/compare.tsx"),
  // the gait's versions (?sort=&dir=&state=&author=&q=&flags=)
  // POST intent=commit (message, draftRevision?); intent=restore (versionId, draftRevision)
  route(":gaitId", "routes/gaits/gait.tsx"),
  // one version, its checks and review history
  // POST intent=request-review, approve, send-back, release or resend-mail
  route(":gaitId/versions/:number", "routes/gaits/version.tsx"),
];
