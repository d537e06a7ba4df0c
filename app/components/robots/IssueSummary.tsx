// Every problem of the working copy in one list, in the words of the form
// ("Leg LF, tibia length must be …"), each linked to its field when the form
// has one (the same messages also sit next to the fields).
import { IssueText } from "~/components/common/IssueList";
import type { DefinitionIssue } from "~/kinematics";

export function IssueSummary({ issues, fieldFor }: { issues: readonly DefinitionIssue[]; fieldFor: (path: string) => string | null }) {
  if (issues.length === 0) return null;
  return (
    <section aria-label="Problems" className="rounded-lg border border-danger bg-danger-soft p-4 text-sm">
      <h3 className="font-semibold text-danger">
        <span aria-hidden>⚠ </span>
        {issues.length === 1 ? "1 problem to fix before saving" : `${issues.length} problems to fix before saving`}
      </h3>
      <ul className="mt-2 space-y-1">
        {issues.map((issue, index) => {
          const target = fieldFor(issue.path);
          const text = <IssueText issue={issue} whole="(the whole definition)" />;
          return (
            <li key={`${issue.path}-${index}`}>
              {target ? (
                <a href={`#${target}`} className="underline underline-offset-2">
                  {text}
                </a>
              ) : (
                text
              )}
            </li>
          );
        })}
      </ul>
    </section>
  );
}
