/** The station the setup tools work on: the one chosen in the header. */
export interface StationRef {
  id: number;
  iata: string;
  name: string;
  timeZone: string;
}
