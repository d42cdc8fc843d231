import { describe, expect, it } from 'vitest';
import { stationTopicsFor } from './publisher';

describe('the station notice that follows a flight’s', () => {
  it('names the alerts only when the change may raise or close one, so a check-in does not make consoles refetch them', () => {
    expect(stationTopicsFor(['forecast', 'counts', 'events'])).toEqual(['departures']);
    expect(stationTopicsFor(undefined)).toEqual(['departures']);
    for (const topic of ['rounds', 'approvals', 'denials', 'compensations']) expect(stationTopicsFor([topic, 'forecast'])).toEqual(['departures', 'alerts']);
  });
});
