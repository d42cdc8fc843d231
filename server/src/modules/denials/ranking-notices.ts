// The denial ranking rides on the forecast's notice. Without it every console of a flight would ask for the ranking
// after every check-in (each request reading its session and user): the ranking is built once per forecast version
// here and sent, as a patch from the one the previous notice brought, to the consoles that show it.
import type { DataSource } from 'typeorm';
import type { CandidatesAnswer } from '@shared/schemas/denial-candidates-patch';
import { announceCommitted } from '../../events';
import type { RecomputeOutcome } from '../forecast/forecast.service';
import { forecastNotice } from '../forecast/forecast-notice';
import { liveStoreOf } from '../forecast/live-store';
import { heldRankingsOf } from './candidates-held';

export interface RankingNotices {
  /**
   * The ranking for the flight's newest forecast version, as the notice should carry it; undefined if it could not be
   * built (the consoles then ask the API). Calls for one flight resolve in the order they were made.
   */
  next(flightId: number): Promise<CandidatesAnswer | undefined>;
}

export function rankingNotices(db: DataSource, log: (line: string) => void = (line) => console.error(line)): RankingNotices {
  const rankings = heldRankingsOf(db);
  /** The tag of the ranking the flight's last notice brought. */
  const sent = new Map<number, string>();
  const queues = new Map<number, Promise<unknown>>();
  liveStoreOf(db).onEvict((flightId) => sent.delete(flightId));
  const build = async (flightId: number): Promise<CandidatesAnswer | undefined> => {
    try {
      const held = await rankings.latest(flightId);
      const answer = JSON.parse(rankings.answer(held, sent.get(flightId))) as CandidatesAnswer;
      sent.set(flightId, held.ranking.tag);
      return answer;
    } catch (err) {
      sent.delete(flightId);
      log(`[denials] the ranking of flight ${flightId} could not go with its notice: ${err instanceof Error ? err.message : String(err)}`);
      return undefined;
    }
  };
  return {
    next(flightId) {
      const answer = (queues.get(flightId) ?? Promise.resolve()).then(() => build(flightId));
      const settled = answer.finally(() => {
        if (queues.get(flightId) === settled) queues.delete(flightId);
      });
      queues.set(flightId, settled);
      return answer;
    },
  };
}

/**
 * What the scheduler calls with each forecast written (and committed): the notice goes out with the ranking for the
 * consoles that show it, in the order the versions were written.
 */
export function forecastAnnouncer(db: DataSource): (o: RecomputeOutcome) => void {
  const rankings = rankingNotices(db);
  return (o) => {
    void rankings.next(o.flightId).then((ranking) => announceCommitted(db, ranking ? { ...forecastNotice(o), desk: { ranking } } : forecastNotice(o)));
  };
}
