import { useEffect, useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import QRCode from 'qrcode';
import { Button } from '../../../components/ui/button';
import { Modal, ModalClose } from '../../../components/ui/dialog';
import { volunteerKeys } from '../api/rounds';

interface Props {
  link: string;
  flightLabel?: string;
  /** The posted offer as text, or null for sealed bids. */
  offerText: string | null;
  extras: string[];
}

/** The passenger link as a button that opens the gate-screen view. */
export function BidLinkQr(props: Props) {
  const [showing, setShowing] = useState(false);
  return (
    <div className="rounded-lg border-2 border-line p-3">
      <p className="font-bold">Passengers offer their seats from their phones.</p>
      <Button className="mt-2 w-full text-lg" onClick={() => setShowing(true)}>
        Show QR for the gate screen
      </Button>
      <Modal open={showing} onOpenChange={setShowing} size="sheet" title="Gate screen: offer your seat" titleHidden>
        {showing && <GateScreen {...props} />}
      </Modal>
    </div>
  );
}

/**
 * Full screen, for a monitor at the gate or a printed sheet: a large QR code and the link written out. While it is
 * open the app underneath is left out of printing, so Print gives one clean page.
 */
function GateScreen({ link, flightLabel, offerText, extras }: Props) {
  const qr = useQuery({
    queryKey: volunteerKeys.qr(link),
    queryFn: () => QRCode.toDataURL(link, { width: 720, margin: 2, errorCorrectionLevel: 'M', color: { dark: '#14202b', light: '#ffffff' } }),
    staleTime: Infinity,
  });

  // Printed, the sheet is the gate screen alone: the staff page underneath is left out.
  useEffect(() => {
    const root = document.getElementById('root');
    root?.classList.add('no-print');
    return () => root?.classList.remove('no-print');
  }, []);

  return (
    <>
      <div className="no-print flex justify-end gap-2 border-b-2 border-line bg-paper p-3">
        <Button variant="secondary" onClick={() => window.print()}>Print</Button>
        <ModalClose variant="primary">Close</ModalClose>
      </div>
      <div className="mx-auto flex max-w-6xl flex-col items-center px-6 py-5 text-center">
        <p className="text-5xl font-bold text-harbour">Volunteers wanted</p>
        {flightLabel && <p className="mt-2 text-3xl font-bold">Flight {flightLabel}</p>}
        <p className="mt-3 text-3xl">
          Give up your seat and take a later flight
          {offerText ? (
            <>
              {' '}for <strong>{offerText}</strong>
            </>
          ) : (
            ': tell us the least you would accept'
          )}
          .
        </p>
        {extras.length > 0 && <p className="mt-2 text-2xl">Plus {extras.join(' · ').toLowerCase()}.</p>}
        <div className="mt-5 flex flex-col items-center gap-6 lg:flex-row lg:items-center lg:text-left">
          {qr.data ? (
            <img src={qr.data} alt={`QR code for ${link}`} className="h-auto w-[min(58vh,90vw)] max-w-[560px] shrink-0 border-4 border-ink print:w-[14cm]" />
          ) : (
            <p className="text-xl text-ink-soft">{qr.error ? `The QR code could not be drawn: ${qr.error.message}` : 'Drawing the QR code…'}</p>
          )}
          <div className="max-w-md">
            <p className="text-3xl font-bold">Scan with your phone’s camera</p>
            <p className="mt-2 text-2xl">You will need your booking reference and your last name.</p>
            <p className="mt-4 text-xl">Or open this link:</p>
            <p className="mt-1 font-mono text-lg break-all" data-testid="bid-link">
              {link}
            </p>
          </div>
        </div>
      </div>
    </>
  );
}
