import { z } from 'zod';

/**
 * Where a booking was made, in our own plain words: the carrier's website, its phone app, a travel agency, or a
 * company's travel desk. Show rates differ by channel (a corporate trip is rebooked freely, an agency booking less so).
 */
export const BOOKING_CHANNELS = ['web', 'app', 'agency', 'corporate'] as const;
export type BookingChannel = (typeof BOOKING_CHANNELS)[number];

/** The channel of an outcome row whose booking named none (older feeds, older manifests). */
export const UNKNOWN_CHANNEL = 'unknown';
export const OUTCOME_CHANNELS = [...BOOKING_CHANNELS, UNKNOWN_CHANNEL] as const;
export type OutcomeChannel = (typeof OUTCOME_CHANNELS)[number];

export const CHANNEL_RULE = `channel must be one of ${BOOKING_CHANNELS.join(', ')}`;
export const bookingChannelSchema = z.enum(BOOKING_CHANNELS, { error: CHANNEL_RULE });

/** The words the screens use for each channel. */
export const CHANNEL_LABELS: Record<OutcomeChannel, string> = {
  web: "carrier's website", app: "carrier's app", agency: 'travel agency', corporate: 'corporate travel desk', unknown: 'not given',
};
