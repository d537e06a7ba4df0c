// A panel of the gait editor: a framed section whose header holds its title,
// which names the section, and the panel's tools or readouts beside it.
import { useId, type ReactNode } from "react";

export function Panel({
  title,
  tools,
  layout,
  className,
  testId,
  children,
}: {
  title: ReactNode;
  /** What the header shows beside the title. */
  tools?: ReactNode;
  /** How the header lays out the title and the tools (flex classes). */
  layout?: string;
  /** More classes of the section (its CSS containment). */
  className?: string;
  testId?: string;
  children: ReactNode;
}) {
  const titleId = useId();
  return (
    <section aria-labelledby={titleId} className={classes("rounded-lg border border-line bg-surface", className)} data-testid={testId}>
      <header className={classes(layout, "border-b border-line px-3 py-2")}>
        <h2 id={titleId} className="font-semibold">
          {title}
        </h2>
        {tools}
      </header>
      {children}
    </section>
  );
}

const classes = (...names: (string | undefined)[]) => names.filter(Boolean).join(" ");
