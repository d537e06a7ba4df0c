// Problems as a list, each written the one way: the path it is at, in code,
// and what is wrong there.
import type { ComponentProps } from "react";

type Issue = { path: string; message: string };

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
          <code className="font-mono">{issue.path || whole}</code>: {issue.message}
        </li>
      ))}
    </ul>
  );
}
