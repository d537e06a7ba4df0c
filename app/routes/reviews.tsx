import type { Route } from "./+types/reviews";
import { EmptyState } from "~/components/common/EmptyState";
import { PageHeader } from "~/components/common/PageHeader";
import { requireAccess } from "~/lib/access.server";

export async function loader({ request }: Route.LoaderArgs) {
  await requireAccess(request, "reviews.read");
  return null;
}

export const meta: Route.MetaFunction = () => [{ title: "Reviews · Gaitloom" }];

export default function Reviews() {
  return (
    <>
      <PageHeader title="Reviews" lead="Gait versions waiting for your decision, and your own versions under review." />
      <EmptyState title="Nothing waits for you">
        When an animator asks for a review of a version, it appears here with its checks and a link to compare it.
      </EmptyState>
    </>
  );
}
