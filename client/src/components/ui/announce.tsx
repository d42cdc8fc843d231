/**
 * A polite, invisible announcement for screen readers. Give it a sentence built only from what matters (counts, a
 * risk level): the browser reads it when the words change, so a redraw that changes nothing, or a clock ticking
 * elsewhere on the screen, says nothing.
 */
export function Announce({ message }: { message: string }) {
  return (
    <p role="status" aria-live="polite" aria-atomic="true" className="sr-only">
      {message}
    </p>
  );
}
