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

/**
 * A unit held before whose content moved. Its reasons carry counts relative to the others ("level with 40 others"),
 * so one check-in rewrites a line in most units: only the lines that differ travel, by index.
 */
export const unitChangeSchema = z.object({
  unitId: z.string(),
  /** Fields other than the position and the reasons that changed, with their new values. */
  fields: denialCandidateSchema.omit({ position: true, unitId: true, reasons: true }).partial().optional(),
  /**
   * Reason lines that differ, as [index, text], or as [index, digit runs] when only numbers moved: the held line's
   * runs of digits replaced in order.
   */
  lines: z.array(z.tuple([z.number().int().min(0), z.union([z.string(), z.array(z.string())])])).optional(),
  /** How many reason lines the unit now has. */
  reasonCount: z.number().int().min(0),
});

export const candidatesPatchSchema = z.object({
  kind: z.literal('patch'),
  tag: z.string(),
  /** The tag the patch applies to. */
  base: z.string(),
  counts: denialCountsSchema,
  /** Every unit's id in rank order: a unit's position is its index plus one. */
  order: z.array(z.string()),
  /** Units not in the base, whole. */
  added: z.array(denialCandidateSchema),
  /** Units of the base whose content (not only their position) changed. */
  changed: z.array(unitChangeSchema),
  /** The excluded list when it changed: every passenger's id in order, and the entries new or changed; else null. */
  excluded: z.object({ order: z.array(z.number()), changed: z.array(excludedCandidateSchema) }).nullable(),
});

/** The console holds the current ranking already. */
export const candidatesSameSchema = z.object({ kind: z.literal('same'), tag: z.string() });

export const candidatesAnswerSchema = z.discriminatedUnion('kind', [taggedCandidatesSchema, candidatesPatchSchema, candidatesSameSchema]);

export type TaggedCandidates = z.infer<typeof taggedCandidatesSchema>;
export type CandidatesPatch = z.infer<typeof candidatesPatchSchema>;
export type CandidatesAnswer = z.infer<typeof candidatesAnswerSchema>;

type Unit = DenialCandidates['candidates'][number];
type UnitChange = z.infer<typeof unitChangeSchema>;
const FIELDS = ['bookingId', 'pnr', 'passengerIds', 'names', 'seatsFreed', 'cabins', 'priorityGroup', 'selection'] as const;

const DIGITS = /\d+/g;
/** The new line as the old one's digit runs replaced, when nothing else differs; otherwise the whole new line. */
function lineChange(was: string | undefined, now: string): string | string[] {
  if (was === undefined || was.replace(DIGITS, '#') !== now.replace(DIGITS, '#')) return now;
  return now.match(DIGITS) ?? [];
}

function applyLine(was: string | undefined, change: string | string[]): string | undefined {
  if (typeof change === 'string') return change;
  if (was === undefined) return undefined;
  let i = 0;
  const line = was.replace(DIGITS, () => change[i++] ?? '');
  return i === change.length ? line : undefined;
}

/** What turns `was` into `now` (same unit id), or null when nothing but the position moved. */
function unitChange(was: Unit, now: Unit): UnitChange | null {
  const fields: Record<string, unknown> = {};
  for (const k of FIELDS) if (JSON.stringify(was[k]) !== JSON.stringify(now[k])) fields[k] = now[k];
  const lines: [number, string | string[]][] = [];
  now.reasons.forEach((line, i) => {
    if (was.reasons[i] !== line) lines.push([i, lineChange(was.reasons[i], line)]);
  });
  const fieldsMoved = Object.keys(fields).length > 0;
  if (!fieldsMoved && !lines.length && was.reasons.length === now.reasons.length) return null;
  return { unitId: now.unitId, ...(fieldsMoved ? { fields } : {}), ...(lines.length ? { lines } : {}), reasonCount: now.reasons.length };
}

/**
 * What turns `from` into `to`; null when the patch would not be smaller (other rules, another flight header), so
 * the whole ranking is sent instead.
 */
export function diffCandidates(from: TaggedCandidates, to: TaggedCandidates): CandidatesPatch | null {
  const fixed = (r: DenialCandidates) => JSON.stringify([r.flight, r.regime, r.rules, r.rulesText]);
  if (fixed(from) !== fixed(to)) return null;
  const held = new Map(from.candidates.map((c) => [c.unitId, c]));
  const added: Unit[] = [];
  const changed: UnitChange[] = [];
  for (const c of to.candidates) {
    const was = held.get(c.unitId);
    if (!was) added.push(c);
    else {
      const change = unitChange(was, c);
      if (change) changed.push(change);
    }
  }
  const wasExcluded = new Map(from.excluded.map((e) => [e.passengerId, JSON.stringify(e)]));
  const excluded = JSON.stringify(from.excluded) === JSON.stringify(to.excluded)
    ? null
    : { order: to.excluded.map((e) => e.passengerId), changed: to.excluded.filter((e) => wasExcluded.get(e.passengerId) !== JSON.stringify(e)) };
  return { kind: 'patch', tag: to.tag, base: from.tag, counts: to.counts, order: to.candidates.map((c) => c.unitId), added, changed, excluded };
}

/**
 * What a console holds after an answer about the ranking (from the API or a notice): the whole one, the one it held
 * (unchanged), or the held one patched; null when the answer does not fit what it holds (fetch the whole ranking).
 */
export function applyCandidatesAnswer(held: TaggedCandidates | undefined, answer: CandidatesAnswer): TaggedCandidates | null {
  if (answer.kind === 'full') return answer;
  if (!held) return null;
  if (answer.kind === 'same') return held.tag === answer.tag ? held : null;
  return applyCandidatesPatch(held, answer);
}

/** Applies a patch to the ranking it was made from; null if `held` is not its base or a unit is missing (refetch whole). */
export function applyCandidatesPatch(held: TaggedCandidates, patch: CandidatesPatch): TaggedCandidates | null {
  if (held.tag !== patch.base) return null;
  const units = new Map(held.candidates.map((c) => [c.unitId, c]));
  for (const change of patch.changed) {
    const was = units.get(change.unitId);
    if (!was) return null;
    const reasons: (string | undefined)[] = was.reasons.slice(0, change.reasonCount);
    for (const [i, line] of change.lines ?? []) reasons[i] = applyLine(was.reasons[i], line);
    if (reasons.length !== change.reasonCount || reasons.some((r) => r === undefined)) return null;
    units.set(change.unitId, { ...was, ...change.fields, reasons: reasons as string[] });
  }
  for (const c of patch.added) units.set(c.unitId, c);
  const candidates: Unit[] = [];
  for (const [i, unitId] of patch.order.entries()) {
    const unit = units.get(unitId);
    if (!unit) return null;
    candidates.push(unit.position === i + 1 ? unit : { ...unit, position: i + 1 });
  }
  let excluded = held.excluded;
  if (patch.excluded) {
    const entries = new Map(held.excluded.map((e) => [e.passengerId, e]));
    for (const e of patch.excluded.changed) entries.set(e.passengerId, e);
    excluded = [];
    for (const id of patch.excluded.order) {
      const e = entries.get(id);
      if (!e) return null;
      excluded.push(e);
    }
  }
  return { ...held, tag: patch.tag, counts: patch.counts, candidates, excluded };
}
