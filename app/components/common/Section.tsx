// A part of a page under its h2, which names the section for assistive technology.
import { useId, type ReactNode } from "react";

export function Section({ title, className = "space-y-2", children }: { title: string; className?: string; children: ReactNode }) {
  const headingId = useId();
  return (
    <section aria-labelledby={headingId} className={className}>
      <h2 id={headingId} className="text-lg font-semibold">
        {title}
      </h2>
      {children}
    </section>
  );
}
