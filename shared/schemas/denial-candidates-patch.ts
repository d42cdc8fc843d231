// The denial ranking as a console keeps it live: a tag names each ranking the server built, and a console that holds
// one asks for what changed since it. A check-in moves one or two units and shifts positions; sending the order and
// the changed units instead of the whole ranking keeps each event's cost per console to a few hundred bytes.
import { z } from 'zod';
import { denialCandidatesSchema, denialCandidateSchema, denialCountsSchema, excludedCandidateSchema, type DenialCandidates } from './denials';

export const candidatesSinceQuerySchema = z.object({
  since: z.string({ error: 'since must be the tag of a ranking held' }).regex(/^[0-9a-z.]{1,40}$/, 'since must be the tag of a ranking held, as received').optional(),
});

/** The whole ranking, with the tag a later request names as `since`. */
export const taggedCandidatesSchema = denialCandidatesSchema.extend({ kind: z.literal('full'), tag: z.string() });

export const candidatesPatchSchema = z.object({
  kind: z.literal('patch'),
  tag: z.string(),
  /** The tag the patch applies to. */
  base: z.string(),
  counts: denialCountsSchema,
  /** Every unit's id in rank order: a unit's position is its index plus one. */
  order: z.array(z.string()),
  /** Units new or changed (anything but their position). */
  changed: z.array(denialCandidateSchema),
  /** The excluded list when it changed (it is short), otherwise null. */
  excluded: z.array(excludedCandidateSchema).nullable(),
});

/** The console holds the current ranking already. */
export const candidatesSameSchema = z.object({ kind: z.literal('same'), tag: z.string() });

export const candidatesAnswerSchema = z.discriminatedUnion('kind', [taggedCandidatesSchema, candidatesPatchSchema, candidatesSameSchema]);

export type TaggedCandidates = z.infer<typeof taggedCandidatesSchema>;
export type CandidatesPatch = z.infer<typeof candidatesPatchSchema>;
export type CandidatesAnswer = z.infer<typeof candidatesAnswerSchema>;

type Unit = DenialCandidates['candidates'][number];
const sameUnit = (a: Unit, b: Unit) => JSON.stringify({ ...a, position: 0 }) === JSON.stringify({ ...b, position: 0 });

/**
 * What turns `from` into `to`; null when the patch would not be smaller (other rules, another flight header), so
 * the whole ranking is sent instead.
 */
export function diffCandidates(from: TaggedCandidates, to: TaggedCandidates): CandidatesPatch | null {
  const fixed = (r: DenialCandidates) => JSON.stringify([r.flight, r.regime, r.rules, r.rulesText]);
  if (fixed(from) !== fixed(to)) return null;
  const held = new Map(from.candidates.map((c) => [c.unitId, c]));
  const changed = to.candidates.filter((c) => {
    const was = held.get(c.unitId);
    return !was || !sameUnit(was, c);
  });
  const excluded = JSON.stringify(from.excluded) === JSON.stringify(to.excluded) ? null : to.excluded;
  return { kind: 'patch', tag: to.tag, base: from.tag, counts: to.counts, order: to.candidates.map((c) => c.unitId), changed, excluded };
}

/** Applies a patch to the ranking it was made from; null if `held` is not its base or a unit is missing (refetch whole). */
export function applyCandidatesPatch(held: TaggedCandidates, patch: CandidatesPatch): TaggedCandidates | null {
  if (held.tag !== patch.base) return null;
  const units = new Map(held.candidates.map((c) => [c.unitId, c]));
  for (const c of patch.changed) units.set(c.unitId, c);
  const candidates: Unit[] = [];
  for (const [i, unitId] of patch.order.entries()) {
    const unit = units.get(unitId);
    if (!unit) return null;
    candidates.push(unit.position === i + 1 ? unit : { ...unit, position: i + 1 });
  }
  return { ...held, tag: patch.tag, counts: patch.counts, candidates, excluded: patch.excluded ?? held.excluded };
}
