/** One booked person (size 1), or a party of `size` people who show up all together or not at all. */
export interface ShowUpUnit {
  size: number;
  showProbability: number;
  /** How many identical copies of this unit are booked; defaults to 1. */
  count?: number;
}

/** One scenario of a common shock: every show probability is multiplied by `probabilityFactor`, capped at 1. */
export interface ShockScenario {
  weight: number;
  probabilityFactor: number;
}

/**
 * A cause that moves everybody's show-up at once (weather, a late inbound connection, a local event), which makes
 * show-ups positively correlated and fattens the oversale tail compared with independent passengers.
 */
export type CommonShock =
  | { kind: 'beta-binomial'; rho: number }
  | { kind: 'scenarios'; scenarios: ShockScenario[] };

export interface OversaleRisk {
  /** P(X > C): more people show than there are seats. */
  pOversale: number;
  /** P(X >= C): the flight goes out full or oversold. */
  pFullOrOver: number;
  /** E[(X - C)+]: expected number of people without a seat before any volunteer is found. */
  expectedDenied: number;
  mean: number;
  sd: number;
  median: number;
}

export interface BookingLimitOptions {
  capacity: number;
  showProbability: number;
  /** Net revenue of one more booking, in any unit as long as costPerDenial uses the same one. */
  revenuePerBooking: number;
  /** Full cost of one denied boarding (compensation, rebooking, goodwill), same unit as revenuePerBooking. */
  costPerDenial: number;
  /** Largest booking count searched; defaults to 2 * capacity + 50. */
  maxBookings?: number;
  shock?: CommonShock;
}

export interface BookingLimitPoint {
  bookings: number;
  expectedNet: number;
  pOversale: number;
  expectedDenied: number;
}

export interface BookingLimitOptimum {
  bookings: number;
  expectedNet: number;
  /** True when the optimum sits on maxBookings: each extra booking still paid off, so the true optimum may be higher. */
  atSearchLimit: boolean;
}
