import { useId, useState, type FormEvent } from 'react';
import { useQuery } from '@tanstack/react-query';
import type { DeskPassenger } from '@shared/schemas/flight-desk';
import type { Round } from '@shared/schemas/volunteers';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/text-field';
import { flightPassengersQueryOptions, useAddVolunteer } from '../api/rounds';
import { parseMoney } from '../model/money';
import { matchingBookings } from '../model/passenger-search';
import { Problem } from './problem';
import type { FieldProblem } from '../../../components/ui/form-problems';

const MAX_BOOKINGS_SHOWN = 8;
const canVolunteer = (p: DeskPassenger) => p.status === 'booked' || p.status === 'checked-in';

/** An agent records a volunteer who came to the counter; ticking only some of a party splits it, by their choice. */
export function AddVolunteer({ round, flightId }: { round: Round; flightId: number }) {
  const [open, setOpen] = useState(false);
  if (!open) {
    return (
      <Button variant="secondary" onClick={() => setOpen(true)}>
        Add a volunteer at the counter
      </Button>
    );
  }
  return <CounterForm round={round} flightId={flightId} onClose={() => setOpen(false)} />;
}

function CounterForm({ round, flightId, onClose }: { round: Round; flightId: number; onClose: () => void }) {
  const passengers = useQuery(flightPassengersQueryOptions(flightId));
  const add = useAddVolunteer(flightId);
  const [query, setQuery] = useState('');
  const [chosen, setChosen] = useState<{ bookingId: number; ids: number[] } | null>(null);
  const [ask, setAsk] = useState('');
  const [askError, setAskError] = useState<string | undefined>();
  const [refused, setRefused] = useState<FieldProblem[] | null>(null);
  const askId = useId();
  const already = new Set(round.volunteers.filter((v) => v.status !== 'withdrawn').map((v) => v.bookingId));
  const parties = matchingBookings(passengers.data?.passengers ?? [], query);

  function toggle(p: DeskPassenger, on: boolean) {
    // One booking at a time: ticking someone on another booking starts a new choice.
    const ids = chosen?.bookingId === p.bookingId ? chosen.ids : [];
    const next = on ? [...ids, p.id] : ids.filter((id) => id !== p.id);
    setChosen(next.length ? { bookingId: p.bookingId, ids: next } : null);
  }

  function submit(e: FormEvent) {
    e.preventDefault();
    if (!chosen) return;
    let askMinor: number | undefined;
    if (round.kind === 'sealed') {
      const parsed = parseMoney(ask, round.currency);
      if (!parsed.ok) {
        setAskError(`ask ${parsed.rule}`);
        return setRefused([{ field: 'askMinor', rule: parsed.rule }]);
      }
      askMinor = parsed.minor;
    }
    setAskError(undefined);
    setRefused(null);
    add.mutate({ roundId: round.id, body: { passengerIds: chosen.ids, askMinor } }, { onSuccess: onClose });
  }

  return (
    <form onSubmit={submit} noValidate aria-label="Add a volunteer at the counter" className="space-y-3 rounded-lg border-2 border-harbour p-3">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h3 className="text-xl font-bold">Add a volunteer at the counter</h3>
        <Button variant="quiet" onClick={onClose}>Cancel</Button>
      </div>
      <TextField label="Find by name or PNR" value={query} onChange={setQuery} autoComplete="off" hint="Tick the travellers who volunteer. Ticking only some of a booking splits it, by their choice." />
      {passengers.isPending && <p className="text-ink-soft">Loading the passenger list…</p>}
      {passengers.error && <Problem error={passengers.error} takeFocus={false} />}
      {query.trim() && parties.length === 0 && passengers.data && <p>No booking matches “{query}”.</p>}
      <ul className="space-y-2">
        {parties.slice(0, MAX_BOOKINGS_SHOWN).map((party) => (
          <li key={party[0].bookingId} className="rounded-md border-2 border-line p-2">
            <p className="font-bold">
              PNR {party[0].pnr}
              {already.has(party[0].bookingId) && <span className="ml-2 font-normal text-watch">already in this round: recording again updates the offer</span>}
            </p>
            {party.map((p) => (
              <label key={p.id} className={`flex items-center gap-2 text-lg ${canVolunteer(p) ? '' : 'text-ink-soft'}`}>
                <input type="checkbox" className="h-5 w-5" disabled={!canVolunteer(p)} checked={chosen?.ids.includes(p.id) ?? false} onChange={(e) => toggle(p, e.target.checked)} />
                {p.firstName} {p.lastName} <span className="text-base text-ink-soft">· {p.status === 'checked-in' ? 'checked in' : p.status}</span>
              </label>
            ))}
          </li>
        ))}
      </ul>
      {parties.length > MAX_BOOKINGS_SHOWN && <p className="text-ink-soft">{parties.length - MAX_BOOKINGS_SHOWN} more bookings match: type more of the name or PNR.</p>}
      {round.kind === 'sealed' && <TextField id={askId} label={`Their ask (${round.currency})`} value={ask} onChange={setAsk} inputMode="decimal" autoComplete="off" error={askError} />}
      <Button type="submit" disabled={!chosen || add.isPending}>
        {chosen ? `Record ${chosen.ids.length === 1 ? 'this volunteer' : `${chosen.ids.length} volunteers`}` : 'Tick who volunteers'}
      </Button>
      <Problem error={add.error} problems={refused} labels={{ askMinor: `Their ask (${round.currency})`, passengerIds: 'Travellers who volunteer' }} fieldIds={{ askMinor: askId }} />
    </form>
  );
}
