// The ways a compensation can reach the passenger. Which of them a rule allows, and which need the passenger's
// agreement, is decided per regime elsewhere; this is only the vocabulary shared by client and server.
export const MEDIA = ['cash', 'cheque', 'bank-transfer', 'prepaid-card', 'travel-credit'] as const;
export type Medium = (typeof MEDIA)[number];

export function isMedium(value: unknown): value is Medium {
  return typeof value === 'string' && (MEDIA as readonly string[]).includes(value);
}
