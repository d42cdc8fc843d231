// The factors an admin may order, with the directions each allows, in the editor's words.
import type { PriorityFactor } from '@shared/denial';

export type Factor = PriorityFactor;

export const FACTORS: Factor[] = ['check-in-time', 'fare-paid', 'frequent-flyer-tier', 'seat-assigned-before-gate', 'party-size'];

export const FACTOR_LABELS: Record<Factor, string> = {
  'check-in-time': 'Check-in time',
  'fare-paid': 'Fare paid',
  'frequent-flyer-tier': 'Frequent-flyer tier',
  'seat-assigned-before-gate': 'Seat assigned before the gate',
  'party-size': 'Party size',
};

export const DIRECTIONS: Record<Factor, { value: string; label: string }[]> = {
  'check-in-time': [{ value: 'latest-first', label: 'latest check-in first' }, { value: 'earliest-first', label: 'earliest check-in first' }],
  'fare-paid': [{ value: 'lowest-first', label: 'lowest fare first' }, { value: 'highest-first', label: 'highest fare first' }],
  'frequent-flyer-tier': [{ value: 'none-first', label: 'no status first, then lowest' }],
  'seat-assigned-before-gate': [{ value: 'unassigned-first', label: 'no seat assigned first' }],
  'party-size': [{ value: 'smallest-first', label: 'smallest parties first' }, { value: 'largest-first', label: 'largest parties first' }],
};
