import type { Route } from "./+types/reviews";
import { EmptyState } from "~/components/common/EmptyState";
import { PageHeader } from "~/components/common/PageHeader";

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
