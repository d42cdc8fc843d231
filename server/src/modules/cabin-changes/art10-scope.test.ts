// Reg. (EC) 261/2004 Art. 10(2): (b) 50 % for intra-Community flights over 1,500 km "except flights between the
// European territory of the Member States and the French overseas departments"; (c) 75 % for the rest, "including"
// those flights. Distances are the project's great-circle figures; the clause is what is checked here.
import { describe, expect, it } from 'vitest';
import { art10IntraCommunity } from './art10-scope';
import { cabinChangeOwed } from './downgrade-rules';
import { routeDistanceKm } from '../../reference/airports';

describe('Art. 10(2) scope', () => {
  it('Paris–Madrid is intra-Community', () => expect(art10IntraCommunity('CDG', 'MAD')).toBe(true));
  it('Paris–Réunion and Pointe-à-Pitre–Paris are not, for Art. 10', () => {
    expect(art10IntraCommunity('CDG', 'RUN')).toBe(false);
    expect(art10IntraCommunity('PTP', 'ORY')).toBe(false);
  });
  it('between two overseas departments it stays intra-Community (the exception names European territory only)', () => {
    expect(art10IntraCommunity('PTP', 'FDF')).toBe(true);
  });
  it('Paris–Réunion downgraded: 75 % of the ticket, not 50 %', () => {
    const distanceKm = routeDistanceKm('CDG', 'RUN');
    expect(distanceKm).toBeGreaterThan(3500);
    const owed = cabinChangeOwed({
      regime: 'eu-261', direction: 'downgrade', ticketPriceMinor: 100_000, fareDifferenceMinor: 0, distanceKm, intraCommunity: art10IntraCommunity('CDG', 'RUN'),
    });
    expect(owed.owedMinor).toBe(75_000);
  });
  it('Paris–Athens downgraded, intra-Community over 1,500 km: 50 % (point (b))', () => {
    const distanceKm = routeDistanceKm('CDG', 'ATH');
    expect(distanceKm).toBeGreaterThan(1500);
    const owed = cabinChangeOwed({ regime: 'eu-261', direction: 'downgrade', ticketPriceMinor: 100_000, fareDifferenceMinor: 0, distanceKm, intraCommunity: art10IntraCommunity('CDG', 'ATH') });
    expect(owed.owedMinor).toBe(50_000);
  });
});
