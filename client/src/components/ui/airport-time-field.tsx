import { localToInstant } from '@shared/time';
import { TextField } from './text-field';
import { zoneLabel } from '../../lib/format';

interface Props {
  /** What the time is, e.g. "Arrives". */
  label: string;
  /** The airport the time happens at: the time is read on its clock, whatever the browser's zone. */
  airport: string;
  timeZone: string;
  value: string;
  onChange: (v: string) => void;
  error?: string;
  /** Lets an error summary link to this field. */
  id?: string;
}

/** A date-time typed on the clock of the airport where it happens, with that airport and zone in the label. */
/** The zone's name on the typed day (summer or winter time), or today's while nothing readable is typed. */
function zoneOn(value: string, timeZone: string) {
  try {
    return zoneLabel(timeZone, new Date(localToInstant('time', value, timeZone)));
  } catch {
    return zoneLabel(timeZone);
  }
}

export function AirportTimeField({ label, airport, timeZone, value, onChange, error, id }: Props) {
  return (
    <TextField
      id={id}
      label={`${label} · ${airport} local time`}
      type="datetime-local"
      value={value}
      onChange={onChange}
      error={error}
      hint={`Read in ${zoneOn(value, timeZone)}`}
    />
  );
}
