// What the export and bring-up pages show once a table is made: its first rows
// with the download, the facts its header carries, and the build script's
// command; `children` go between the facts and the command (the release record).
import type { ReactNode } from "react";
import { CopyCommand } from "./CopyCommand";
import { TableFacts, type TableFactsData } from "./TableFacts";
import { TablePreview, type TablePreviewData } from "./TablePreview";

export function TableResult({
  table,
  download,
  busy,
  children,
}: {
  table: { preview: TablePreviewData; facts: TableFactsData };
  download: { path: string; fileName: string; command: string };
  /** Another table is on its way: this one is dimmed. */
  busy: boolean;
  children?: ReactNode;
}) {
  return (
    <div className="mt-6 grid gap-6 xl:grid-cols-[minmax(0,1fr)_24rem]">
      <section aria-labelledby="preview-heading" className={`min-w-0 ${busy ? "opacity-60" : ""}`}>
        <div className="mb-2 flex flex-wrap items-center justify-between gap-x-3 gap-y-2">
          <h2 id="preview-heading" className="text-lg font-semibold">
            Preview
          </h2>
          {/* The file name names the calibration profile: shown whole, broken anywhere rather than cut. */}
          <a
            href={download.path}
            download={download.fileName}
            className="flex max-w-full min-w-0 flex-col rounded-md bg-accent px-4 py-1.5 text-on-accent hover:bg-accent-strong"
          >
            <span className="font-medium">Download </span>
            <span className="font-mono text-xs break-all">{download.fileName}</span>
          </a>
        </div>
        <TablePreview preview={table.preview} />
      </section>
      <aside className="space-y-4">
        <section aria-labelledby="facts-heading" className="rounded-lg border border-line bg-surface p-4">
          <h2 id="facts-heading" className="mb-2 font-semibold">
            In the table's header
          </h2>
          <TableFacts facts={table.facts} />
        </section>
        {children}
        <CopyCommand command={download.command} />
      </aside>
    </div>
  );
}
