// Problems as a list, each written the one way: the message alone when it
// names its field in words (a robot definition's: "Leg LF, tibia length must
// be …"), else the path it is at, in code, and what is wrong there.
import type { ComponentProps } from "react";
import type { Issue } from "~/platform/errors";

/** One issue as the lists show it. */
export function IssueText({ issue, whole = "" }: { issue: Issue; whole?: string }) {
  if (issue.field) return <>{issue.message}</>;
  return (
    <>
      <code className="font-mono">{issue.path || whole}</code>: {issue.message}
    </>
  );
}

export function IssueList({
  issues,
  whole = "",
  ...list
}: {
  issues: readonly Issue[];
  /** What an empty path names ("(the whole file)"). */
  whole?: string;
} & ComponentProps<"ul">) {
  return (
    <ul {...list}>
      {issues.map((issue, index) => (
        <li key={`${issue.path}-${index}`}>
          <IssueText issue={issue} whole={whole} />
        </li>
      ))}
    </ul>
  );
}
