/** A failed action said in the server's own words, right where the agent pressed. */
export function Problem({ error }: { error: unknown }) {
  if (!error) return null;
  const text = error instanceof Error ? error.message : String(error);
  return (
    <p role="alert" className="mt-2 rounded-md border-l-4 border-alert bg-alert-soft px-3 py-2 font-bold text-alert">
      <span aria-hidden>⚠ </span>
      {text}
    </p>
  );
}
