// Requests per second a desk read serves at 50 connections, beside a route behind the same middleware (helmet,
// session, sign-in state) whose answer is a small constant: the share tells what the desk read itself costs.
import autocannon from 'autocannon';

export interface Throughput {
  path: string;
  requestsPerSecond: number;
  p99Ms: number;
  non2xx: number;
}

export interface ThroughputFigures {
  desk: Throughput;
  reference: Throughput;
  /** desk / reference; the target is at least 0.5. */
  ratio: number;
}

const CONNECTIONS = 50;

async function measure(url: string, cookie: string, seconds: number): Promise<Throughput> {
  const r = await autocannon({ url, connections: CONNECTIONS, duration: seconds, headers: { cookie, accept: 'application/json' } });
  return { path: new URL(url).pathname, requestsPerSecond: r.requests.average, p99Ms: r.latency.p99, non2xx: r.non2xx };
}

/** Both routes, one after the other, `seconds` each, on the same signed-in session. */
export async function compareThroughput(appUrl: string, cookie: string, flightId: number, seconds: number): Promise<ThroughputFigures> {
  // The reference: the session route answers the signed-in state from memory behind the same middleware.
  const reference = await measure(`${appUrl}/api/auth/session`, cookie, seconds);
  const desk = await measure(`${appUrl}/api/flights/${flightId}`, cookie, seconds);
  return { desk, reference, ratio: desk.requestsPerSecond / Math.max(1, reference.requestsPerSecond) };
}
