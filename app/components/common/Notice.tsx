/** A one-line outcome above a form: an error (role="alert") or a confirmation (role="status"). */
export function Notice({ error, success }: { error?: string | null; success?: string | null }) {
  if (error) {
    return (
      <p role="alert" className="mb-4 flex gap-2 rounded-md bg-danger-soft px-4 py-2 text-danger">
        <span aria-hidden="true">✕</span>
        {error}
      </p>
    );
  }
  if (success) {
    return (
      <p role="status" className="mb-4 flex gap-2 rounded-md bg-ok-soft px-4 py-2 text-ok">
        <span aria-hidden="true">✓</span>
        {success}
      </p>
    );
  }
  return null;
}
