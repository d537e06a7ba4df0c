// The cautions of DESIGN.md ("Safety"), shown wherever a table leaves the app.
import { SAFETY_NOTICE } from "~/export";

export function SafetyNotice() {
  const [headline, ...cautions] = SAFETY_NOTICE;
  return (
    <section aria-labelledby="safety-heading" className="mb-6 rounded-lg border-2 border-warning bg-warning-soft px-5 py-4 text-ink">
      <h2 id="safety-heading" className="flex items-center gap-2 font-semibold text-warning">
        <span aria-hidden="true" className="text-lg">
          ⚠
        </span>
        {headline}
      </h2>
      <ul className="mt-2 list-disc space-y-0.5 pl-6 text-sm">
        {cautions.map((line) => (
          <li key={line}>{line}</li>
        ))}
      </ul>
    </section>
  );
}
