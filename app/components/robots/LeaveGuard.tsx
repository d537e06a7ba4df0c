// Unsaved edits to a robot are not lost by leaving the page: a link or the
// browser's Back within the app asks first (our dialog), and closing or
// reloading the tab gets the browser's own question. Moving within the page
// (the problem list's links to fields) is not leaving.
import { useEffect, useRef } from "react";
import { useBlocker } from "react-router";

const button = "rounded-md px-3 py-1.5 font-medium";

export function LeaveGuard({ dirty }: { dirty: boolean }) {
  const blocker = useBlocker(({ currentLocation, nextLocation }) => dirty && currentLocation.pathname !== nextLocation.pathname);
  const dialog = useRef<HTMLDialogElement>(null);

  useEffect(() => {
    if (!dirty) return;
    const warn = (event: BeforeUnloadEvent) => event.preventDefault();
    window.addEventListener("beforeunload", warn);
    return () => window.removeEventListener("beforeunload", warn);
  }, [dirty]);

  // The edits were saved or discarded while the question was open: nothing is lost by going on.
  useEffect(() => {
    if (blocker.state === "blocked" && !dirty) blocker.proceed();
  }, [blocker, dirty]);

  const blocked = blocker.state === "blocked";
  useEffect(() => {
    const element = dialog.current;
    if (!element) return;
    if (blocked && !element.open) element.showModal();
    if (!blocked && element.open) element.close();
  }, [blocked]);

  return (
    <dialog
      ref={dialog}
      aria-labelledby="leave-title"
      aria-describedby="leave-text"
      // Escape closes the dialog: that is staying.
      onClose={() => {
        if (blocker.state === "blocked") blocker.reset();
      }}
      className="m-auto w-[30rem] max-w-[95vw] rounded-lg border border-line bg-surface p-0 text-ink shadow-xl backdrop:bg-ink/40"
    >
      <div className="p-5">
        <h2 id="leave-title" className="text-lg font-semibold">
          Leave without saving?
        </h2>
        <p id="leave-text" className="mt-2 text-sm">
          This robot has changes that are not saved. If you leave now, they are lost; stay to save them as a new revision or discard them yourself.
        </p>
        <div className="mt-4 flex justify-end gap-2">
          <button type="button" autoFocus className={`${button} bg-accent text-on-accent hover:bg-accent-strong`} onClick={() => blocker.reset?.()}>
            Stay on this robot
          </button>
          <button type="button" className={`${button} border border-danger text-danger hover:bg-danger-soft`} onClick={() => blocker.proceed?.()}>
            Leave and lose the changes
          </button>
        </div>
      </div>
    </dialog>
  );
}
