// What an import would do to one flight, passenger by passenger: added, changed (a manifest field or the journey
// differs) and removed (stored, travelling, and missing from the file, so the import would cancel them).
import type { ManifestFlightDiff } from '@shared/schemas/manifest';
import { itineraryCell } from '@shared/schemas/itinerary';
import type { EntityManager } from 'typeorm';
import type { BookingEntity, PassengerEntity } from '../../db/entities';
import { manifestFields, passengerKey, storedManifest } from './manifest-apply';
import type { ManifestFlightGroup } from './manifest-rows';

/** Names listed in the preview; the counts are always complete. */
const NAMES_SHOWN = 20;

const same = (a: unknown, b: unknown) => JSON.stringify(a) === JSON.stringify(b);

function differs(stored: PassengerEntity, next: ReturnType<typeof manifestFields>): boolean {
  return (Object.keys(next) as (keyof typeof next)[]).some((k) => {
    const a = stored[k];
    const b = next[k];
    if (a instanceof Date || b instanceof Date) return (a as Date | null)?.getTime() !== (b as Date | null)?.getTime();
    return !same(a, b);
  });
}

export async function flightDiff(em: EntityManager, flightId: number, group: ManifestFlightGroup): Promise<ManifestFlightDiff> {
  const stored = await storedManifest(em, flightId, false);
  const bookingOf = new Map<number, BookingEntity>([...stored.bookingsByPnr.values()].map((b) => [b.id, b]));
  const diff: ManifestFlightDiff = { added: 0, changed: 0, removed: 0, unchanged: 0, removedNames: [], addedNames: [], changedNames: [] };
  const inFile = new Set<string>();
  const push = (list: string[], name: string) => { if (list.length < NAMES_SHOWN) list.push(name); };
  for (const b of group.bookings.values()) {
    for (const p of b.passengers) {
      const key = passengerKey(b.pnr, p.sequence);
      inFile.add(key);
      const existing = stored.passengersByKey.get(key);
      const name = `${p.row.first_name} ${p.row.last_name} (${b.pnr})`;
      if (!existing || existing.status === 'cancelled') {
        diff.added++;
        push(diff.addedNames, name);
      } else if (differs(existing, manifestFields(p)) || itineraryCell(bookingOf.get(existing.bookingId)?.itinerary) !== itineraryCell(b.itinerary)) {
        diff.changed++;
        push(diff.changedNames, name);
      } else diff.unchanged++;
    }
  }
  for (const [key, p] of stored.passengersByKey) {
    if (inFile.has(key) || p.status === 'cancelled') continue;
    diff.removed++;
    push(diff.removedNames, `${p.firstName} ${p.lastName} (${key.split('|')[0]})${p.status === 'checked-in' || p.status === 'boarded' ? `, ${p.status}` : ''}`);
  }
  return diff;
}
