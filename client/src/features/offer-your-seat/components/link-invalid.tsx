/** A tampered or expired link: nothing can be done here, and nothing is kept. */
export function LinkInvalid() {
  return (
    <div role="alert" className="rounded-xl border-4 border-alert bg-card p-6" data-testid="link-invalid">
      <h1 className="text-3xl font-bold text-alert">This link does not work</h1>
      <p className="mt-3 text-xl">It may be out of date or incomplete.</p>
      <p className="mt-3 text-2xl font-bold">Please ask the gate agent for help, or scan the code on the gate screen again.</p>
      <p className="mt-3 text-lg text-ink-soft">Nothing was sent and nothing was saved.</p>
    </div>
  );
}
