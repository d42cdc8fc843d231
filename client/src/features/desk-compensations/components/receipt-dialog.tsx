import * as Dialog from '@radix-ui/react-dialog';
import { useQuery } from '@tanstack/react-query';
import { Button } from '../../../components/ui/button';
import { receiptQueryOptions } from '../api/compensations';

/** The passenger's receipt, with the agreement's text where there is one and the signature, ready to print. */
export function ReceiptDialog({ compensationId }: { compensationId: number }) {
  return (
    <Dialog.Root>
      <Dialog.Trigger asChild>
        <Button variant="secondary">Show the receipt</Button>
      </Dialog.Trigger>
      <Dialog.Portal>
        <Dialog.Overlay className="fixed inset-0 bg-black/40 print:hidden" />
        <Dialog.Content className="fixed inset-4 overflow-auto rounded-lg bg-card p-6 text-lg shadow-xl print:static print:inset-0 print:shadow-none" data-testid="receipt">
          <Dialog.Title className="text-2xl font-bold">Receipt</Dialog.Title>
          <Dialog.Description className="text-ink-soft print:hidden">Print it for the passenger, or let them photograph it.</Dialog.Description>
          <ReceiptBody compensationId={compensationId} />
          <div className="mt-4 flex gap-3 print:hidden">
            <Button onClick={() => window.print()}>Print</Button>
            <Dialog.Close asChild>
              <Button variant="secondary">Close</Button>
            </Dialog.Close>
          </div>
        </Dialog.Content>
      </Dialog.Portal>
    </Dialog.Root>
  );
}

function ReceiptBody({ compensationId }: { compensationId: number }) {
  const receipt = useQuery(receiptQueryOptions(compensationId));
  if (receipt.isPending) return <p>Loading…</p>;
  if (receipt.error) return <p role="alert" className="font-bold text-alert">The receipt could not be loaded: {receipt.error.message}</p>;
  const r = receipt.data.receipt;
  return (
    <div className="mt-3 space-y-3">
      <ul className="space-y-1">
        {r.lines.map((line) => (
          <li key={line}>{line}</li>
        ))}
      </ul>
      {r.agreementText && (
        <section>
          <h3 className="font-bold">The agreement the passenger signed</h3>
          <pre className="whitespace-pre-wrap font-sans">{r.agreementText}</pre>
        </section>
      )}
      {r.signature && <img src={r.signature} alt="The passenger’s signature" className="h-32 border-b-2 border-ink" />}
      <p className="text-base text-ink-soft">
        Bumpboard computes what the configured rules say; the applicable regulation, the contract of carriage and the carrier’s compliance staff decide.
      </p>
    </div>
  );
}
