/** What a page shows when there is nothing yet, and what to do about it. */
export function EmptyState({ title, children }: { title: string; children: React.ReactNode }) {
  return (
    <div className="rounded-lg border border-dashed border-line bg-surface px-8 py-10 text-center">
      <h2 className="text-lg font-semibold">{title}</h2>
      <div className="mx-auto mt-2 max-w-md text-ink-muted">{children}</div>
    </div>
  );
}
