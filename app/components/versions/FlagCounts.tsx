// Error and warning counts of a version, by shape and word as well as colour.
export function FlagCounts({ errors, warnings }: { errors: number; warnings: number }) {
  if (errors === 0 && warnings === 0) {
    return (
      <span className="whitespace-nowrap text-ok">
        <span aria-hidden="true">✓ </span>clean
      </span>
    );
  }
  return (
    <span className="inline-flex flex-wrap gap-x-2 whitespace-nowrap">
      {errors > 0 ? (
        <span className="text-danger">
          <span aria-hidden="true">✕ </span>
          <span className="tabular-nums">{errors}</span> error{errors === 1 ? "" : "s"}
        </span>
      ) : null}
      {warnings > 0 ? (
        <span className="text-warning">
          <span aria-hidden="true">▲ </span>
          <span className="tabular-nums">{warnings}</span> warning{warnings === 1 ? "" : "s"}
        </span>
      ) : null}
    </span>
  );
}
