// The list of keyboard shortcuts, in a modal dialog.
import { forwardRef } from "react";
import { SHORTCUTS } from "~/features/gaits/editor/shortcuts";

export const HelpDialog = forwardRef<HTMLDialogElement>(function HelpDialog(_, ref) {
  return (
    <dialog
      ref={ref}
      aria-labelledby="shortcuts-title"
      className="m-auto w-[36rem] max-w-[95vw] rounded-lg border border-line bg-surface p-0 text-ink shadow-xl backdrop:bg-ink/40"
    >
      <div className="p-5">
        <h2 id="shortcuts-title" className="text-lg font-semibold">
          Keyboard shortcuts
        </h2>
        <table className="mt-3 w-full text-sm">
          <caption className="sr-only">Keys and what they do in the gait editor</caption>
          <thead className="text-left text-ink-muted">
            <tr>
              <th scope="col" className="py-1 pr-4 font-medium">
                Keys
              </th>
              <th scope="col" className="py-1 font-medium">
                Does
              </th>
            </tr>
          </thead>
          <tbody>
            {SHORTCUTS.map((shortcut) => (
              <tr key={shortcut.keys} className="border-t border-line">
                <td className="py-1 pr-4 font-mono whitespace-nowrap">{shortcut.keys}</td>
                <td className="py-1">{shortcut.does}</td>
              </tr>
            ))}
          </tbody>
        </table>
        <form method="dialog" className="mt-4 text-right">
          <button type="submit" className="rounded-md bg-accent px-3 py-1.5 font-medium text-on-accent hover:bg-accent-strong">
            Close
          </button>
        </form>
      </div>
    </dialog>
  );
});
