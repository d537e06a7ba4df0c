// A shell command for the build script, with a button that copies it.
import { useState } from "react";

export function CopyCommand({ command, label = "API command for the build script" }: { command: string; label?: string }) {
  const [copied, setCopied] = useState<"idle" | "copied" | "failed">("idle");
  const copy = async () => {
    try {
      await navigator.clipboard.writeText(command);
      setCopied("copied");
    } catch {
      setCopied("failed");
    }
    setTimeout(() => setCopied("idle"), 2500);
  };
  return (
    <div className="rounded-lg border border-line bg-surface p-4">
      <div className="flex items-center justify-between gap-3">
        <h3 className="text-sm font-medium">{label}</h3>
        <button type="button" onClick={copy} className="rounded-md border border-line px-3 py-1 text-sm hover:bg-sunken">
          {copied === "copied" ? "Copied ✓" : copied === "failed" ? "Select and copy by hand" : "Copy command"}
        </button>
      </div>
      <pre data-testid="curl-command" className="mt-2 overflow-x-auto rounded bg-sunken px-3 py-2 font-mono text-xs whitespace-pre-wrap break-all">
        {command}
      </pre>
      <p className="mt-2 text-xs text-ink-muted">
        Set <code className="font-mono">GAITLOOM_TOKEN</code> to a token from Settings → API tokens. Add{" "}
        <code className="font-mono">--etag-save tag --etag-compare tag</code> to fetch only when the table changed.
      </p>
    </div>
  );
}
