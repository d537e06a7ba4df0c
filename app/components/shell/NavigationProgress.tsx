// Progress for a page that is slow to come: after a short pause (a quick page
// shows none), a bar across the top of the window creeps towards the end and
// the header says what is under way, until the page is there. The words sit in
// a live region that is always on the page, so screen readers hear them come.
import { useEffect, useState } from "react";
import { useNavigation } from "react-router";

/** How long a navigation may take before the progress shows (ms). */
export const PROGRESS_DELAY_MS = 300;

type Phase = "hidden" | "started" | "creeping";

export function NavigationProgress() {
  const navigation = useNavigation();
  const busy = navigation.state !== "idle";
  const [phase, setPhase] = useState<Phase>("hidden");

  useEffect(() => {
    if (!busy) {
      setPhase("hidden");
      return;
    }
    let frame = 0;
    const timer = setTimeout(() => {
      setPhase("started");
      // The bar is drawn short first and creeps on a frame later, so that its width is a transition.
      frame = requestAnimationFrame(() => {
        frame = requestAnimationFrame(() => setPhase("creeping"));
      });
    }, PROGRESS_DELAY_MS);
    return () => {
      clearTimeout(timer);
      cancelAnimationFrame(frame);
    };
  }, [busy]);

  const shown = phase !== "hidden";
  const words = navigation.state === "submitting" ? "Sending…" : "Loading the page…";
  return (
    <>
      {shown ? (
        <div aria-hidden="true" className="fixed inset-x-0 top-0 z-50 h-1 bg-accent-soft">
          <div
            data-testid="navigation-progress-bar"
            className={`h-full bg-accent transition-[width] ease-out motion-reduce:transition-none ${
              phase === "creeping" ? "w-[90%] duration-[8000ms]" : "w-[15%] duration-0"
            }`}
          />
        </div>
      ) : null}
      {/* A live region without the status role: pages keep their one status line for their own outcomes. */}
      <p aria-live="polite" aria-atomic="true" className={shown ? "text-sm text-ink-muted" : "sr-only"}>
        {shown ? words : ""}
      </p>
    </>
  );
}
