import { Link } from "react-router";
import type { Route } from "./+types/reviews";
import { EmptyState } from "~/components/common/EmptyState";
import { PageHeader } from "~/components/common/PageHeader";
import { ReviewQueueList } from "~/components/versions/ReviewQueueList";
import { requireAccess } from "~/platform/access.server";
import { can, type RoutePermissions } from "~/platform/permissions";
import { reviewQueue } from "~/features/versions/review.server";

export const permissions = { loader: "reviews.read" } satisfies RoutePermissions;

export async function loader({ request }: Route.LoaderArgs) {
  const member = await requireAccess(request, permissions.loader);
  return { queue: await reviewQueue(member), canDecide: can(member.role, "versions.decide"), canRequest: can(member.role, "versions.requestReview") };
}

export const meta: Route.MetaFunction = () => [{ title: "Reviews · Gaitloom" }];

export default function Reviews({ loaderData }: Route.ComponentProps) {
  const { queue, canDecide, canRequest } = loaderData;
  const nothing = queue.assigned.length === 0 && queue.mine.length === 0 && queue.toRelease.length === 0;
  return (
    <>
      <PageHeader title="Reviews" lead="Gait versions waiting for your decision, and your own versions under review." />
      {nothing ? (
        <EmptyState title="Nothing waits for you">
          {canDecide
            ? "When someone asks you to review a version, it appears here with its checks and a link to compare it."
            : canRequest
              ? "Commit a version on a gait's page and request a review; its progress shows here."
              : "Versions in review are listed on each gait's page."}{" "}
          <Link to="/gaits" className="text-accent underline underline-offset-2">
            See the gaits
          </Link>
          .
        </EmptyState>
      ) : (
        <div className="space-y-8">
          {canDecide || queue.assigned.length > 0 ? (
            <ReviewQueueList id="assigned" title="Waiting for your review" empty="No version waits for your review." items={queue.assigned} show="author" />
          ) : null}
          {queue.toRelease.length > 0 ? (
            <ReviewQueueList id="release" title="Approved, ready to release" empty="" items={queue.toRelease} show="author" />
          ) : null}
          <ReviewQueueList id="mine" title="Your versions" empty="None of your versions is in review or decided lately." items={queue.mine} show="decision" />
        </div>
      )}
    </>
  );
}
