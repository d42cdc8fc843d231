import type { FlightCareResponse, PassengerCare } from '@shared/schemas/care';
import { formatMoney, formatTimeWithZone } from '../../../lib/format';
import { CareGivenForm } from './care-given-form';
import { ChoiceForm } from './choice-form';
import { MailCareButton } from './mail-care-button';

const KIND_WORDS: Record<string, string> = { meal: 'Meal', refreshment: 'Refreshments', hotel: 'Hotel', transport: 'Transport', communication: 'Calls or messages' };

function waitWords(minutes: number | null): string {
  if (minutes === null) return 'No alternate booked yet';
  const h = Math.floor(minutes / 60);
  const m = minutes % 60;
  return `Waits ${h > 0 ? `${h} h ` : ''}${m} min for the alternate`;
}

export function PassengerCareCard({ flightId, passenger: p, data }: { flightId: number; passenger: PassengerCare; data: FlightCareResponse }) {
  const headingId = `care-${p.compensationId}`;
  return (
    <article aria-labelledby={headingId} className="rounded-md border-2 border-line p-3">
      <header className="mb-2 flex flex-wrap items-baseline gap-x-3">
        <h3 id={headingId} className="text-lg font-bold">{p.passengerName}</h3>
        <span className="text-ink-soft">{p.voluntary ? 'Volunteer' : 'Denied against their will'}</span>
        <span className="text-ink-soft">
          {p.alternate ? `Alternate ${p.alternate.label}, leaves ${formatTimeWithZone(p.alternate.departure, data.timeZone)}` : 'No alternate booked'} · {waitWords(p.proposal.waitMinutes)}
        </span>
      </header>
      <div className="grid gap-4 lg:grid-cols-2">
        <section aria-label={`Choice of ${p.passengerName}`}>
          <h4 className="font-bold">The passenger’s choice</h4>
          {p.choice ? (
            <div className="mt-1 space-y-1">
              <p><strong>{p.choice.label}.</strong> {p.choice.detail}</p>
              {p.choice.note && <p>Note: {p.choice.note}</p>}
              <p className="text-sm text-ink-soft">Recorded by {p.choice.recordedBy}, {formatTimeWithZone(p.choice.recordedAt, data.timeZone)}</p>
              {p.refundOwed && <p className="font-bold">Ticket refund owed: {formatMoney(p.refundOwed.amountMinor, p.refundOwed.currency)} ({p.refundOwed.state})</p>}
            </div>
          ) : (
            <ChoiceForm flightId={flightId} passenger={p} />
          )}
        </section>
        <section aria-label={`Care for ${p.passengerName}`}>
          <h4 className="font-bold">Care due for this wait</h4>
          {p.proposal.items.length === 0 ? (
            <p className="text-ink-soft">None proposed.</p>
          ) : (
            <ul className="mt-1 list-disc space-y-1 pl-5">
              {p.proposal.items.map((i) => (
                <li key={i.kind}>
                  {i.description}{i.quantity > 1 ? ` × ${i.quantity}` : ''}
                  {i.suggestedMinor !== null && <> · suggested {formatMoney(i.suggestedMinor, data.currency)}</>}
                  <span className="block text-sm text-ink-soft">{i.source}{i.basis === 'common-practice' ? ' · hours are common practice, not the rule’s text' : ''}</span>
                </li>
              ))}
            </ul>
          )}
          {p.proposal.notes.map((n) => <p key={n} className="mt-1 text-sm text-ink-soft">{n}</p>)}
          <h4 className="mt-3 font-bold">Given so far</h4>
          {p.given.length === 0 ? (
            <p className="text-ink-soft">Nothing recorded yet.</p>
          ) : (
            <ul role="list" className="mt-1 space-y-1" aria-label={`Care given to ${p.passengerName}`}>
              {p.given.map((g) => (
                <li key={g.id}>
                  <strong>{KIND_WORDS[g.kind]}:</strong> {g.description}{g.hotelName ? ` at ${g.hotelName}` : ''}
                  {g.amountMinor !== null && g.currency && <> · {formatMoney(g.amountMinor, g.currency)}</>} · by {g.providedBy}
                </li>
              ))}
            </ul>
          )}
          <CareGivenForm flightId={flightId} passenger={p} data={data} />
        </section>
      </div>
      <MailCareButton flightId={flightId} passenger={p} />
    </article>
  );
}
