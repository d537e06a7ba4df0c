// A button that copies a text to the clipboard and says, for a moment, whether it did.
import { useEffect, useState } from "react";

export function CopyButton({ text, label, className = "" }: { text: string; label: string; className?: string }) {
  const [state, setState] = useState<"idle" | "copied" | "failed">("idle");
  useEffect(() => {
    if (state === "idle") return;
    const timer = setTimeout(() => setState("idle"), 2500);
    return () => clearTimeout(timer);
  }, [state]);
  const copy = async () => {
    try {
      await navigator.clipboard.writeText(text);
      setState("copied");
    } catch {
      setState("failed");
    }
  };
  return (
    <button type="button" onClick={copy} className={`rounded-md border border-line bg-surface px-3 py-1 text-sm font-medium hover:bg-sunken ${className}`}>
      <span aria-live="polite">{state === "copied" ? "Copied ✓" : state === "failed" ? "Select and copy by hand" : label}</span>
    </button>
  );
}
