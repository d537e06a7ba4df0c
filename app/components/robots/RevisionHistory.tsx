// Every saved revision of a robot, newest first, with a link to view each and
// to download its JSON; and the robot pages' button that downloads one.
import { Link } from "react-router";
import { FramedTable, type Column } from "~/components/common/FramedTable";
import { Section } from "~/components/common/Section";
import { formatTime } from "~/platform/format";

export type RevisionRow = {
  number: number;
  message: string;
  author: { login: string; name: string } | null;
  createdAt: Date | string;
};

const COLUMNS: readonly Column[] = [
  { label: "Revision", align: "right" },
  { label: "Message" },
  { label: "Author" },
  { label: "Saved", align: "right" },
  { label: "Actions", hidden: true },
];

const downloadPath = (robotId: string, number: number) => `/robots/${robotId}/revisions/${number}/download`;

export function DownloadRevisionLink({ robotId, number }: { robotId: string; number: number }) {
  return (
    <a href={downloadPath(robotId, number)} download className="rounded-md border border-line bg-surface px-3 py-1.5 text-sm font-medium hover:bg-sunken">
      Download JSON
    </a>
  );
}

/** The robot pages' section: its heading and the table. */
export function RevisionHistory({ robotId, revisions, current }: { robotId: string; revisions: readonly RevisionRow[]; current?: number }) {
  return (
    <Section title="Revision history" className="mt-10 space-y-2">
      <FramedTable label="Revision history, newest first" columns={COLUMNS}>
        {revisions.map((revision, index) => (
          <tr key={revision.number} className={`border-b border-line last:border-0 ${revision.number === current ? "bg-accent-soft" : ""}`}>
            <td className="px-3 py-2 text-right font-mono tabular-nums">
              {revision.number}
              {index === 0 ? <span className="ml-2 rounded bg-sunken px-1.5 py-0.5 font-sans text-xs text-ink-muted">newest</span> : null}
            </td>
            <td className="px-3 py-2">{revision.message || <span className="text-ink-muted">(no message)</span>}</td>
            <td className="px-3 py-2">{revision.author?.name ?? <span className="text-ink-muted">unknown</span>}</td>
            <td className="px-3 py-2 text-right whitespace-nowrap tabular-nums">
              <time dateTime={new Date(revision.createdAt).toISOString()}>{formatTime(revision.createdAt)}</time>
            </td>
            <td className="px-3 py-2 whitespace-nowrap">
              <span className="flex justify-end gap-3">
                <Link
                  to={`/robots/${robotId}/revisions/${revision.number}`}
                  className="text-accent underline underline-offset-2"
                  aria-label={`View revision ${revision.number}`}
                >
                  View
                </Link>
                <a
                  href={downloadPath(robotId, revision.number)}
                  download
                  className="text-accent underline underline-offset-2"
                  aria-label={`Download JSON of revision ${revision.number}`}
                >
                  Download JSON
                </a>
              </span>
            </td>
          </tr>
        ))}
      </FramedTable>
    </Section>
  );
}
