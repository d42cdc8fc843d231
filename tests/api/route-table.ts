/**
 * Every route of the API, one row each, for the access-control matrix in route-matrix.test.ts.
 *
 * TO ADD A ROUTE: add one row to ROUTES below. Give
 *   - method and pattern exactly as Express registers them (pattern with `:params`, e.g. /api/users/:id);
 *     the matrix fails while a registered route has no row, or a row names a route that is not registered;
 *   - access: 'public', or the roles that may call it;
 *   - call(ctx, scope): the URL and a valid body. With scope 'own' the call must succeed for every allowed role;
 *     with scope 'other' it must point at an object of ctx.otherStationId (only asked when otherStation is set);
 *     call() runs once per request, so create unique values (ctx.uniqueEmail) inside it;
 *   - success: the status a right role gets;
 *   - otherStation: for station-scoped routes, the status an allowed role gets for another station's object
 *     (404 when the route hides that the object exists, 403 when the caller names the station themselves).
 * If a route needs an object that ctx lacks, add it to RouteContext and create it in the matrix's beforeAll.
 */
import type { Role } from '@shared/schemas/common';
import { DEMO, TEST_PASSWORD } from './helpers';
import { DEMO_PASSWORD } from './harness';
import type { DenialRouteContext } from './denials-fixtures';
import type { VolunteerRouteContext } from './volunteers-route-context';
import type { PaymentsRouteContext } from './payments-route-context';
import type { LearningRouteContext } from './learning-route-context';
import { DEFAULT_SHOW_UP_PROFILE } from '@shared/schemas/show-up-profile';
import { ADMIN_ROUTES, type AdminRouteContext } from './admin-route-context';

export type Method = 'GET' | 'POST' | 'PATCH' | 'PUT' | 'DELETE';
export type Scope = 'own' | 'other';

export interface RouteContext {
  /** A station every demo user belongs to. */
  ownStationId: number;
  /** A station no demo user belongs to. */
  otherStationId: number;
  /** A user on the own station only, free to be modified by the tests. */
  ownUserId: number;
  /** A user on the other station only. */
  otherUserId: number;
  uniqueEmail(label: string): string;
  /** A flight departing from each station, and an integration key of each. */
  ownFlightId: number;
  otherFlightId: number;
  ownKeyId: number;
  otherKeyId: number;
  /** A working feed key of the own station and a flight reference it may post events for. */
  ownFeedKey: string;
  ownFlightRef: { carrier: string; number: string; date: string };
  /** A failed notice on the scope's flight, fresh for each call (a re-queued notice is no longer failed). */
  failedNoticeId(scope: Scope): string;
  /** Proposals, denials and flights for the denied-boarding routes (tests/api/denials-fixtures.ts). */
  denials: DenialRouteContext;
  /** Rounds, volunteers, approvals and a passenger link for the volunteer routes (tests/api/volunteers-route-context.ts). */
  volunteers: VolunteerRouteContext;
  /** Compensations in each state the money routes expect, and reconciliation runs (tests/api/payments-route-context.ts). */
  payments: PaymentsRouteContext;
  /** Flights, schedules and notices for the admin screens' routes (tests/api/admin-route-context.ts). */
  admin: AdminRouteContext;
  /** A closed flight with an outcome at each station (tests/api/learning-route-context.ts). */
  learning: LearningRouteContext;
}

export interface RouteCall {
  url: string;
  body?: unknown;
}

export interface RouteRow {
  method: Method;
  pattern: string;
  /** 'api-key': the departure-control feed, which authenticates with a station key, never a session. */
  access: 'public' | 'api-key' | readonly Role[];
  call(ctx: RouteContext, scope: Scope): RouteCall;
  success: number;
  otherStation?: 403 | 404;
}

const ALL_ROLES: readonly Role[] = ['agent', 'supervisor', 'finance', 'admin'];
const GATE_ROLES: readonly Role[] = ['agent', 'supervisor', 'admin'];
const flightOf = (ctx: RouteContext, scope: Scope) => (scope === 'own' ? ctx.ownFlightId : ctx.otherFlightId);
const stationOf = (ctx: RouteContext, scope: Scope) => (scope === 'own' ? ctx.ownStationId : ctx.otherStationId);

export const ROUTES: readonly RouteRow[] = [
  { method: 'GET', pattern: '/api/health', access: 'public', call: () => ({ url: '/api/health' }), success: 200 },
  { method: 'GET', pattern: '/api/auth/session', access: 'public', call: () => ({ url: '/api/auth/session' }), success: 200 },
  {
    method: 'POST',
    pattern: '/api/auth/sign-in',
    access: 'public',
    call: () => ({ url: '/api/auth/sign-in', body: { email: DEMO.agent, password: DEMO_PASSWORD } }),
    success: 200,
  },
  { method: 'POST', pattern: '/api/auth/sign-out', access: 'public', call: () => ({ url: '/api/auth/sign-out' }), success: 204 },
  { method: 'GET', pattern: '/api/users', access: ['admin'], call: () => ({ url: '/api/users' }), success: 200 },
  {
    method: 'POST',
    pattern: '/api/users',
    access: ['admin'],
    call: (ctx, scope) => ({
      url: '/api/users',
      body: {
        email: ctx.uniqueEmail('matrix'),
        displayName: 'Matrix test user',
        role: 'agent',
        stationIds: [scope === 'own' ? ctx.ownStationId : ctx.otherStationId],
        password: TEST_PASSWORD,
      },
    }),
    success: 201,
    // The caller names the station in the body, so refusing it reveals nothing new.
    otherStation: 403,
  },
  {
    method: 'PATCH',
    pattern: '/api/users/:id',
    access: ['admin'],
    call: (ctx, scope) => ({ url: `/api/users/${scope === 'own' ? ctx.ownUserId : ctx.otherUserId}`, body: { displayName: 'Renamed by the matrix' } }),
    success: 200,
    otherStation: 404,
  },
  { method: 'GET', pattern: '/api/stations', access: ALL_ROLES, call: () => ({ url: '/api/stations' }), success: 200 },
  {
    method: 'GET',
    pattern: '/api/departures',
    access: GATE_ROLES,
    call: (ctx, scope) => ({ url: `/api/departures?stationId=${scope === 'own' ? ctx.ownStationId : ctx.otherStationId}` }),
    success: 200,
    otherStation: 404,
  },
  { method: 'GET', pattern: '/api/flights/:id', access: GATE_ROLES, call: (ctx, scope) => ({ url: `/api/flights/${flightOf(ctx, scope)}` }), success: 200, otherStation: 404 },
  { method: 'GET', pattern: '/api/flights/:id/passengers', access: GATE_ROLES, call: (ctx, scope) => ({ url: `/api/flights/${flightOf(ctx, scope)}/passengers` }), success: 200, otherStation: 404 },
  { method: 'GET', pattern: '/api/flights/:id/forecast-history', access: GATE_ROLES, call: (ctx, scope) => ({ url: `/api/flights/${flightOf(ctx, scope)}/forecast-history` }), success: 200, otherStation: 404 },
  { method: 'GET', pattern: '/api/flights/:id/events', access: GATE_ROLES, call: (ctx, scope) => ({ url: `/api/flights/${flightOf(ctx, scope)}/events` }), success: 200, otherStation: 404 },
  {
    method: 'PUT',
    pattern: '/api/flights/:id/shock',
    access: ['supervisor', 'admin'],
    // Setting "no shock" keeps the shared demo flight's figures as they were.
    call: (ctx, scope) => ({ url: `/api/flights/${flightOf(ctx, scope)}/shock`, body: { shock: null, reason: 'route matrix check' } }),
    success: 200,
    otherStation: 404,
  },
  { method: 'GET', pattern: '/api/stations/:stationId/integration-keys', access: ['admin'], call: (ctx, scope) => ({ url: `/api/stations/${stationOf(ctx, scope)}/integration-keys` }), success: 200, otherStation: 404 },
  {
    method: 'POST',
    pattern: '/api/stations/:stationId/integration-keys',
    access: ['admin'],
    call: (ctx, scope) => ({ url: `/api/stations/${stationOf(ctx, scope)}/integration-keys`, body: { name: 'route matrix' } }),
    success: 201,
    otherStation: 404,
  },
  {
    method: 'DELETE',
    pattern: '/api/stations/:stationId/integration-keys/:keyId',
    access: ['admin'],
    call: (ctx, scope) => ({ url: `/api/stations/${stationOf(ctx, scope)}/integration-keys/${scope === 'own' ? ctx.ownKeyId : ctx.otherKeyId}` }),
    success: 200,
    otherStation: 404,
  },
  { method: 'GET', pattern: '/api/plans', access: ['supervisor', 'admin'], call: (ctx, scope) => ({ url: `/api/plans?stationId=${stationOf(ctx, scope)}&routeKey=BOS-ORD` }), success: 200, otherStation: 404 },
  {
    method: 'POST',
    pattern: '/api/plans',
    access: ['supervisor', 'admin'],
    call: (ctx, scope) => ({ url: '/api/plans', body: { stationId: stationOf(ctx, scope), routeKey: 'BOS-ORD', name: 'Route matrix plan', inputs: { capacity: 150, showProbability: 0.9, revenuePerBookingMinor: 20_000, costPerDenialMinor: 40_000, currency: 'USD' } } }),
    success: 201,
    otherStation: 404,
  },
  { method: 'POST', pattern: '/api/learning/jobs', access: ['admin'], call: () => ({ url: '/api/learning/jobs' }), success: 202 },
  { method: 'GET', pattern: '/api/learning/jobs/latest', access: ['admin', 'supervisor'], call: () => ({ url: '/api/learning/jobs/latest' }), success: 200 },
  { method: 'GET', pattern: '/api/learning/stations/:stationId', access: ['admin', 'supervisor'], call: (ctx, scope) => ({ url: `/api/learning/stations/${stationOf(ctx, scope)}` }), success: 200, otherStation: 404 },
  {
    method: 'PUT',
    pattern: '/api/learning/stations/:stationId/choice',
    access: ['admin'],
    // The hand-set profile, where every station starts: the demo's odds stay as they were.
    call: (ctx, scope) => ({ url: `/api/learning/stations/${stationOf(ctx, scope)}/choice`, body: { mode: 'hand-set', pinnedVersion: null } }),
    success: 200,
    otherStation: 404,
  },
  { method: 'GET', pattern: '/api/learning/stations/:stationId/routes/:destination', access: GATE_ROLES, call: (ctx, scope) => ({ url: `/api/learning/stations/${stationOf(ctx, scope)}/routes/ORD` }), success: 200, otherStation: 404 },
  { method: 'GET', pattern: '/api/learning/stations/:stationId/closed-flights', access: ['admin', 'supervisor'], call: (ctx, scope) => ({ url: `/api/learning/stations/${stationOf(ctx, scope)}/closed-flights` }), success: 200, otherStation: 404 },
  { method: 'GET', pattern: '/api/learning/closed-flights/:id/outcomes', access: ['admin', 'supervisor'], call: (ctx, scope) => ({ url: `/api/learning/closed-flights/${ctx.learning.closedFlightId(scope)}/outcomes` }), success: 200, otherStation: 404 },
  {
    method: 'PATCH',
    pattern: '/api/learning/outcomes/:id',
    access: ['admin', 'supervisor'],
    call: (ctx, scope) => ({ url: `/api/learning/outcomes/${ctx.learning.outcomeId(scope)}`, body: { outcome: 'no-show', reason: 'route matrix check' } }),
    success: 200,
    otherStation: 404,
  },
  { method: 'GET', pattern: '/api/stations/:stationId/show-up-profile', access: ['supervisor', 'admin'], call: (ctx, scope) => ({ url: `/api/stations/${stationOf(ctx, scope)}/show-up-profile` }), success: 200, otherStation: 404 },
  {
    method: 'PUT',
    pattern: '/api/stations/:stationId/show-up-profile',
    access: ['admin'],
    // The default profile: writing it leaves the demo's odds as they were.
    call: (ctx, scope) => ({ url: `/api/stations/${stationOf(ctx, scope)}/show-up-profile`, body: DEFAULT_SHOW_UP_PROFILE }),
    success: 200,
    otherStation: 404,
  },
  { method: 'GET', pattern: '/api/stations/:stationId/manifests/template', access: ['admin'], call: (ctx, scope) => ({ url: `/api/stations/${stationOf(ctx, scope)}/manifests/template` }), success: 200, otherStation: 404 },
  // The matrix sends JSON, not a file: an allowed role gets past access control and is told the file is missing.
  { method: 'POST', pattern: '/api/stations/:stationId/manifests/preview', access: ['admin'], call: (ctx, scope) => ({ url: `/api/stations/${stationOf(ctx, scope)}/manifests/preview` }), success: 400, otherStation: 404 },
  { method: 'POST', pattern: '/api/stations/:stationId/manifests/import', access: ['admin'], call: (ctx, scope) => ({ url: `/api/stations/${stationOf(ctx, scope)}/manifests/import` }), success: 400, otherStation: 404 },
  { method: 'GET', pattern: '/api/flights/:flightId/notices', access: GATE_ROLES, call: (ctx, scope) => ({ url: `/api/flights/${flightOf(ctx, scope)}/notices` }), success: 200, otherStation: 404 },
  {
    method: 'POST',
    pattern: '/api/flights/:flightId/notices/:id/retry',
    access: ['supervisor', 'admin'],
    call: (ctx, scope) => ({ url: `/api/flights/${flightOf(ctx, scope)}/notices/${ctx.failedNoticeId(scope)}/retry` }),
    success: 200,
    otherStation: 404,
  },
  {
    method: 'POST',
    pattern: '/api/integrations/events',
    access: 'api-key',
    call: (ctx) => ({ url: '/api/integrations/events', body: { events: [{ id: `matrix-${Date.now()}-${Math.random()}`, type: 'inbound.updated', occurredAt: new Date().toISOString(), flight: ctx.ownFlightRef, inboundFlight: 'ZZ000', estimatedArrival: new Date().toISOString() }] } }),
    success: 200,
  },
  // Involuntary denied boarding. Calls that change an object take a fresh one from ctx.denials' pools.
  { method: 'GET', pattern: '/api/stations/:stationId/priority-rules', access: GATE_ROLES, call: (ctx, scope) => ({ url: `/api/stations/${stationOf(ctx, scope)}/priority-rules` }), success: 200, otherStation: 404 },
  {
    method: 'PUT',
    pattern: '/api/stations/:stationId/priority-rules',
    access: ['admin'],
    // The station's own rules as found: writing them back changes nothing.
    call: (ctx, scope) => ({ url: `/api/stations/${stationOf(ctx, scope)}/priority-rules`, body: ctx.denials.ownRules }),
    success: 200,
    otherStation: 404,
  },
  { method: 'GET', pattern: '/api/stations/:stationId/denial-proposals', access: ['supervisor', 'admin'], call: (ctx, scope) => ({ url: `/api/stations/${stationOf(ctx, scope)}/denial-proposals` }), success: 200, otherStation: 404 },
  { method: 'GET', pattern: '/api/flights/:flightId/denial-candidates', access: GATE_ROLES, call: (ctx, scope) => ({ url: `/api/flights/${flightOf(ctx, scope)}/denial-candidates` }), success: 200, otherStation: 404 },
  { method: 'GET', pattern: '/api/flights/:flightId/denial-proposals', access: GATE_ROLES, call: (ctx, scope) => ({ url: `/api/flights/${flightOf(ctx, scope)}/denial-proposals` }), success: 200, otherStation: 404 },
  {
    method: 'POST',
    pattern: '/api/flights/:flightId/denial-proposals',
    access: ['agent', 'supervisor'],
    call: (ctx, scope) => ({ url: `/api/flights/${scope === 'own' ? ctx.denials.nextProposeFlight() : ctx.otherFlightId}/denial-proposals`, body: { seatsNeeded: 1, reason: 'route matrix check' } }),
    success: 201,
    otherStation: 404,
  },
  {
    method: 'POST',
    pattern: '/api/denial-proposals/:id/authorize',
    access: ['supervisor'],
    call: (ctx, scope) => ({ url: `/api/denial-proposals/${scope === 'own' ? ctx.denials.authorizeProposalId : ctx.denials.other.proposalId}/authorize`, body: {} }),
    success: 200,
    otherStation: 404,
  },
  {
    method: 'POST',
    pattern: '/api/denial-proposals/:id/change',
    access: ['supervisor', 'admin'],
    call: (ctx, scope) => {
      const target = scope === 'own' ? ctx.denials.nextChangeProposal() : { proposalId: ctx.denials.other.proposalId, denialId: ctx.denials.other.denialId };
      return { url: `/api/denial-proposals/${target.proposalId}/change`, body: { remove: [target.denialId], reason: 'route matrix check' } };
    },
    success: 200,
    otherStation: 404,
  },
  {
    method: 'POST',
    pattern: '/api/denial-proposals/:id/withdraw',
    access: GATE_ROLES,
    call: (ctx, scope) => ({ url: `/api/denial-proposals/${scope === 'own' ? ctx.denials.withdrawProposalId : ctx.denials.other.proposalId}/withdraw`, body: { reason: 'route matrix check' } }),
    success: 200,
    otherStation: 404,
  },
  {
    method: 'POST',
    pattern: '/api/denials/:id/rebook',
    access: GATE_ROLES,
    call: (ctx, scope) => ({ url: `/api/denials/${scope === 'own' ? ctx.denials.nextRebookDenial() : ctx.denials.other.denialId}/rebook`, body: { noAlternate: true } }),
    success: 200,
    otherStation: 404,
  },
  { method: 'GET', pattern: '/api/flights/:flightId/boarding-refusals', access: GATE_ROLES, call: (ctx, scope) => ({ url: `/api/flights/${flightOf(ctx, scope)}/boarding-refusals` }), success: 200, otherStation: 404 },
  {
    method: 'POST',
    pattern: '/api/flights/:flightId/boarding-refusals',
    access: ['agent', 'supervisor'],
    call: (ctx, scope) => {
      if (scope === 'other') return { url: `/api/flights/${ctx.otherFlightId}/boarding-refusals`, body: { passengerIds: [1], ground: 'conduct', reason: 'route matrix check' } };
      const { flightId, passengerId } = ctx.denials.nextRefusal();
      return { url: `/api/flights/${flightId}/boarding-refusals`, body: { passengerIds: [passengerId], ground: 'conduct', reason: 'route matrix check' } };
    },
    success: 201,
    otherStation: 404,
  },
  {
    method: 'POST',
    pattern: '/api/flights/:flightId/denials/recorded',
    access: ['supervisor'],
    call: (ctx, scope) => {
      if (scope === 'other') return { url: `/api/flights/${ctx.otherFlightId}/denials/recorded`, body: { passengerIds: [1], occurredAt: new Date().toISOString(), reason: 'route matrix check' } };
      const { flightId, passengerId, occurredAt } = ctx.denials.nextRecorded();
      return { url: `/api/flights/${flightId}/denials/recorded`, body: { passengerIds: [passengerId], occurredAt, reason: 'route matrix check' } };
    },
    success: 201,
    otherStation: 404,
  },
  { method: 'GET', pattern: '/api/denials/:id/statement', access: GATE_ROLES, call: (ctx, scope) => ({ url: `/api/denials/${scope === 'own' ? ctx.denials.statementDenialId : ctx.denials.other.denialId}/statement` }), success: 200, otherStation: 404 },
  // Volunteer rounds. Calls that change an object take a fresh one from ctx.volunteers' pools; another station's
  // objects are hidden (404) before anything about them is read.
  { method: 'GET', pattern: '/api/flights/:flightId/rounds', access: GATE_ROLES, call: (ctx, scope) => ({ url: `/api/flights/${flightOf(ctx, scope)}/rounds` }), success: 200, otherStation: 404 },
  {
    method: 'POST',
    pattern: '/api/flights/:flightId/rounds',
    access: GATE_ROLES,
    call: (ctx, scope) => ({ url: `/api/flights/${scope === 'own' ? ctx.volunteers.nextRoundlessFlight() : ctx.otherFlightId}/rounds`, body: { kind: 'sealed', volunteersNeeded: 1 } }),
    success: 201,
    otherStation: 404,
  },
  { method: 'GET', pattern: '/api/flights/:flightId/alternates', access: GATE_ROLES, call: (ctx, scope) => ({ url: `/api/flights/${flightOf(ctx, scope)}/alternates` }), success: 200, otherStation: 404 },
  {
    method: 'POST',
    pattern: '/api/rounds/:id/raise',
    access: GATE_ROLES,
    // Above an agent's limit this still answers 200, with approvalRequested: each call has a round of its own.
    call: (ctx, scope) => ({ url: `/api/rounds/${scope === 'own' ? ctx.volunteers.nextRaiseRound() : ctx.volunteers.other.roundId}/raise`, body: { offerMinor: 25_000 } }),
    success: 200,
    otherStation: 404,
  },
  { method: 'POST', pattern: '/api/rounds/:id/close', access: GATE_ROLES, call: (ctx, scope) => ({ url: `/api/rounds/${scope === 'own' ? ctx.volunteers.nextCloseRound() : ctx.volunteers.other.roundId}/close` }), success: 200, otherStation: 404 },
  {
    method: 'POST',
    pattern: '/api/rounds/:id/volunteers',
    access: GATE_ROLES,
    call: (ctx, scope) => ({ url: `/api/rounds/${scope === 'own' ? ctx.volunteers.offerRoundId : ctx.volunteers.other.roundId}/volunteers`, body: { passengerIds: [ctx.volunteers.offerPassengerId] } }),
    success: 201,
    otherStation: 404,
  },
  {
    method: 'POST',
    pattern: '/api/rounds/:id/volunteers/:volunteerId/accept',
    access: GATE_ROLES,
    call: (ctx, scope) => ({ url: scope === 'own' ? `/api/rounds/${ctx.volunteers.offerRoundId}/volunteers/${ctx.volunteers.nextAcceptVolunteer()}/accept` : `/api/rounds/${ctx.volunteers.other.roundId}/volunteers/${ctx.volunteers.other.volunteerId}/accept` }),
    success: 200,
    otherStation: 404,
  },
  {
    method: 'POST',
    pattern: '/api/rounds/:id/volunteers/:volunteerId/decline',
    access: GATE_ROLES,
    call: (ctx, scope) => ({ url: scope === 'own' ? `/api/rounds/${ctx.volunteers.offerRoundId}/volunteers/${ctx.volunteers.nextDeclineVolunteer()}/decline` : `/api/rounds/${ctx.volunteers.other.roundId}/volunteers/${ctx.volunteers.other.volunteerId}/decline` }),
    success: 200,
    otherStation: 404,
  },
  {
    method: 'POST',
    pattern: '/api/volunteers/:id/rebook',
    access: GATE_ROLES,
    call: (ctx, scope) => ({
      url: `/api/volunteers/${scope === 'own' ? ctx.volunteers.nextRebookVolunteer() : ctx.volunteers.other.volunteerId}/rebook`,
      body: { manual: { carrier: 'XY', number: '204', departure: '2034-06-01T20:00:00Z', arrival: '2034-06-01T22:00:00Z' } },
    }),
    success: 200,
    otherStation: 404,
  },
  { method: 'GET', pattern: '/api/approvals', access: ['supervisor', 'admin'], call: (ctx, scope) => ({ url: `/api/approvals?stationId=${stationOf(ctx, scope)}` }), success: 200, otherStation: 404 },
  {
    method: 'POST',
    pattern: '/api/approvals/:id',
    access: ['supervisor'],
    call: (ctx, scope) => ({ url: `/api/approvals/${scope === 'own' ? ctx.volunteers.nextApproval() : ctx.volunteers.other.approvalId}`, body: { approve: false, reason: 'route matrix check' } }),
    success: 200,
    otherStation: 404,
  },
  { method: 'GET', pattern: '/api/stations/:stationId/volunteer-policy', access: GATE_ROLES, call: (ctx, scope) => ({ url: `/api/stations/${stationOf(ctx, scope)}/volunteer-policy` }), success: 200, otherStation: 404 },
  {
    method: 'PUT',
    pattern: '/api/stations/:stationId/volunteer-policy',
    access: ['admin'],
    // The station's own policy as found: writing it back changes nothing.
    call: (ctx, scope) => ({ url: `/api/stations/${stationOf(ctx, scope)}/volunteer-policy`, body: ctx.volunteers.ownPolicy }),
    success: 200,
    otherStation: 404,
  },
  // The passenger's "Offer your seat" page: no session, a signed link and proof of the booking instead.
  { method: 'GET', pattern: '/api/public/offers/:token', access: 'public', call: (ctx) => ({ url: `/api/public/offers/${ctx.volunteers.offerToken}` }), success: 200 },
  { method: 'POST', pattern: '/api/public/offers/:token/identify', access: 'public', call: (ctx) => ({ url: `/api/public/offers/${ctx.volunteers.offerToken}/identify`, body: ctx.volunteers.publicBooking }), success: 200 },
  { method: 'POST', pattern: '/api/public/offers/:token/bids', access: 'public', call: (ctx) => ({ url: `/api/public/offers/${ctx.volunteers.offerToken}/bids`, body: { passengerToken: ctx.volunteers.passengerToken, acceptPosted: true } }), success: 201 },
  {
    method: 'GET',
    pattern: '/api/public/offers/:token/status',
    access: 'public',
    call: (ctx) => ({ url: `/api/public/offers/${ctx.volunteers.offerToken}/status?passengerToken=${encodeURIComponent(ctx.volunteers.passengerToken)}` }),
    success: 200,
  },
  // The passenger's own payment pages: no session; a single-use link's token in the body. Without a live link the
  // answer is the same "link not valid" for everyone, signed in or not (the link tests cover the working path).
  ...(['/api/public/payments/card-details/status', '/api/public/payments/card-details/reveal', '/api/public/payments/payout/status'] as const).map((pattern) => ({
    method: 'POST' as const, pattern, access: 'public' as const, call: () => ({ url: pattern, body: { token: 'unknown-link-token-unknown-link', pnr: 'ABC123', lastName: 'Tester' } }), success: 404,
  })),
  {
    method: 'POST', pattern: '/api/public/payments/payout/account', access: 'public', success: 404,
    call: () => ({ url: '/api/public/payments/payout/account', body: { token: 'unknown-link-token-unknown-link', pnr: 'ABC123', lastName: 'Tester', holderName: 'Ana Tester', routingNumber: '110000000', accountNumber: '000123456789', accountNumberAgain: '000123456789', accountType: 'checking' } }),
  },
  // Compensation money: agents choose the medium, record agreements, pay at the counter and issue; finance voids and
  // re-issues; both read receipts; nobody else.
  { method: 'GET', pattern: '/api/flights/:flightId/compensations', access: ['agent'], call: (ctx, scope) => ({ url: `/api/flights/${flightOf(ctx, scope)}/compensations` }), success: 200, otherStation: 404 },
  { method: 'POST', pattern: '/api/compensations/:id/issue', access: ['agent'], call: (ctx, scope) => ({ url: `/api/compensations/${scope === 'own' ? ctx.payments.issuedId : ctx.payments.other.compensationId}/issue` }), success: 200, otherStation: 404 },
  { method: 'POST', pattern: '/api/compensations/:id/voucher-offer', access: ['agent'], call: (ctx, scope) => ({ url: `/api/compensations/${scope === 'own' ? ctx.payments.dueId : ctx.payments.other.compensationId}/voucher-offer` }), success: 200, otherStation: 404 },
  { method: 'POST', pattern: '/api/compensations/:id/medium', access: ['agent'], call: (ctx, scope) => ({ url: `/api/compensations/${scope === 'own' ? ctx.payments.dueId : ctx.payments.other.compensationId}/medium`, body: { medium: 'prepaid-card' } }), success: 200, otherStation: 404 },
  // A compensation not issued yet has no passenger link to replace: past the role and station checks, refused on its state.
  { method: 'POST', pattern: '/api/compensations/:id/new-link', access: ['agent'], call: (ctx, scope) => ({ url: `/api/compensations/${scope === 'own' ? ctx.payments.dueId : ctx.payments.other.compensationId}/new-link` }), success: 409, otherStation: 404 },
  // A schema-valid agreement whose text is not the one for this compensation: past the role check, refused on its text.
  {
    method: 'POST',
    pattern: '/api/compensations/:id/agreement',
    access: ['agent'],
    call: (ctx, scope) => ({ url: `/api/compensations/${scope === 'own' ? ctx.payments.dueId : ctx.payments.other.compensationId}/agreement`, body: { medium: 'travel-credit', valueMinor: 100_000, expiresOn: null, text: 'Route matrix: not the text shown to this passenger.', signature: `data:image/png;base64,${'A'.repeat(400)}` } }),
    success: 409,
    otherStation: 404,
  },
  {
    method: 'POST',
    pattern: '/api/compensations/:id/counter-payment',
    access: ['agent'],
    call: (ctx, scope) => ({ url: `/api/compensations/${scope === 'own' ? ctx.payments.offeredId : ctx.payments.other.compensationId}/counter-payment`, body: { medium: 'cash', drawerId: 'MATRIX', amountMinor: ctx.payments.offeredAmountMinor, signature: `data:image/png;base64,${'A'.repeat(400)}` } }),
    success: 200,
    otherStation: 404,
  },
  // A volunteer's compensation has no band to top up: past the role check, refused on the rule.
  { method: 'POST', pattern: '/api/compensations/:id/actual-arrival', access: ['agent'], call: (ctx, scope) => ({ url: `/api/compensations/${scope === 'own' ? ctx.payments.issuedId : ctx.payments.other.compensationId}/actual-arrival`, body: { arrivalDelayMinutes: 420 } }), success: 409, otherStation: 404 },
  { method: 'GET', pattern: '/api/compensations/:id/receipt', access: ['agent', 'finance'], call: (ctx, scope) => ({ url: `/api/compensations/${scope === 'own' ? ctx.payments.issuedId : ctx.payments.other.compensationId}/receipt` }), success: 200, otherStation: 404 },
  { method: 'POST', pattern: '/api/compensations/:id/void', access: ['finance'], call: (ctx, scope) => ({ url: `/api/compensations/${scope === 'own' ? ctx.payments.voidableId : ctx.payments.other.compensationId}/void`, body: { reason: 'route matrix check' } }), success: 200, otherStation: 404 },
  {
    method: 'POST',
    pattern: '/api/compensations/:id/reissue',
    access: ['agent', 'finance'],
    // A fresh failed compensation for each call while they last: each successful re-issue moves one on.
    call: (ctx, scope) => ({ url: `/api/compensations/${scope === 'own' ? (ctx.payments.failedIds.length > 1 ? ctx.payments.failedIds.shift() : ctx.payments.failedIds[0]) : ctx.payments.other.compensationId}/reissue`, body: { reason: 'route matrix check' } }),
    success: 200,
    otherStation: 404,
  },
  // Cabin changes: the desk records and lists them.
  { method: 'GET', pattern: '/api/flights/:flightId/cabin-changes', access: ['agent', 'supervisor'], call: (ctx, scope) => ({ url: `/api/flights/${flightOf(ctx, scope)}/cabin-changes` }), success: 200, otherStation: 404 },
  { method: 'GET', pattern: '/api/flights/:flightId/refunds', access: ['agent', 'supervisor'], call: (ctx, scope) => ({ url: `/api/flights/${flightOf(ctx, scope)}/refunds` }), success: 200, otherStation: 404 },
  {
    method: 'POST',
    pattern: '/api/flights/:flightId/cabin-changes',
    access: ['agent', 'supervisor'],
    // One passenger per successful call: a second change for the same passenger is refused.
    call: (ctx, scope) => ({ url: `/api/flights/${scope === 'own' ? ctx.payments.cabinFlightId : ctx.otherFlightId}/cabin-changes`, body: { passengerId: scope === 'own' ? (ctx.payments.cabinPassengerIds.length > 1 ? ctx.payments.cabinPassengerIds.shift() : ctx.payments.cabinPassengerIds[0]) : 1, flownCabin: 'Y', fareDifferenceMinor: 0, reason: 'route matrix check' } }),
    success: 201,
    otherStation: 404,
  },
  // Care and the passenger's choice: the desk records them per compensation; admins set allowances; finance reads costs.
  { method: 'GET', pattern: '/api/flights/:flightId/care', access: ['agent', 'supervisor'], call: (ctx, scope) => ({ url: `/api/flights/${flightOf(ctx, scope)}/care` }), success: 200, otherStation: 404 },
  {
    method: 'POST',
    pattern: '/api/compensations/:id/choice',
    access: ['agent', 'supervisor'],
    // The same choice again answers as the first time, so every allowed role can call it on one compensation.
    call: (ctx, scope) => ({ url: `/api/compensations/${scope === 'own' ? ctx.payments.dueId : ctx.payments.other.compensationId}/choice`, body: { kind: 'reroute-earliest' } }),
    success: 201,
    otherStation: 404,
  },
  {
    method: 'POST',
    pattern: '/api/compensations/:id/care',
    access: ['agent', 'supervisor'],
    call: (ctx, scope) => ({ url: `/api/compensations/${scope === 'own' ? ctx.payments.dueId : ctx.payments.other.compensationId}/care`, body: { kind: 'meal', description: 'Meal voucher', amountMinor: 1_200, providedBy: 'route matrix' } }),
    success: 201,
    otherStation: 404,
  },
  {
    method: 'POST',
    pattern: '/api/compensations/:id/care-mail',
    access: ['agent', 'supervisor'],
    // The same text again finds the mail already queued: every allowed role gets the same answer.
    call: (ctx, scope) => ({ url: `/api/compensations/${scope === 'own' ? ctx.payments.dueId : ctx.payments.other.compensationId}/care-mail` }),
    success: 200,
    otherStation: 404,
  },
  { method: 'GET', pattern: '/api/stations/:stationId/care-setup', access: ['admin'], call: (ctx, scope) => ({ url: `/api/stations/${stationOf(ctx, scope)}/care-setup` }), success: 200, otherStation: 404 },
  {
    method: 'PUT',
    pattern: '/api/stations/:stationId/care-setup',
    access: ['admin'],
    call: (ctx, scope) => ({ url: `/api/stations/${stationOf(ctx, scope)}/care-setup`, body: { refreshmentMinor: 500, mealMinor: 1_500, hotels: [] } }),
    success: 200,
    otherStation: 404,
  },
  { method: 'GET', pattern: '/api/care/ledger', access: ['finance'], call: (ctx, scope) => ({ url: `/api/care/ledger?stationId=${stationOf(ctx, scope)}` }), success: 200, otherStation: 404 },
  { method: 'GET', pattern: '/api/care/ledger.csv', access: ['finance'], call: (ctx, scope) => ({ url: `/api/care/ledger.csv?stationId=${stationOf(ctx, scope)}` }), success: 200, otherStation: 404 },
  // Alerts: everyone at a station sees and acknowledges its own.
  { method: 'GET', pattern: '/api/alerts', access: ALL_ROLES, call: (ctx, scope) => ({ url: `/api/alerts?stationId=${stationOf(ctx, scope)}` }), success: 200, otherStation: 404 },
  { method: 'POST', pattern: '/api/alerts/:id/acknowledge', access: ALL_ROLES, call: (ctx, scope) => ({ url: `/api/alerts/${scope === 'own' ? ctx.payments.alertId : ctx.payments.other.alertId}/acknowledge` }), success: 200, otherStation: 404 },
  // The provider's webhook: no session, a signature instead; an unsigned call is refused with 400.
  { method: 'POST', pattern: '/api/payments/webhook', access: 'public', call: () => ({ url: '/api/payments/webhook', body: { id: 'evt_unsigned', type: 'issuing_card.created' } }), success: 400 },
  // Finance's screens: finance only, within its stations.
  { method: 'GET', pattern: '/api/finance/compensations', access: ['finance'], call: (ctx, scope) => ({ url: `/api/finance/compensations?stationId=${stationOf(ctx, scope)}` }), success: 200, otherStation: 404 },
  { method: 'GET', pattern: '/api/finance/counter-register', access: ['finance'], call: (ctx, scope) => ({ url: `/api/finance/counter-register?stationId=${stationOf(ctx, scope)}` }), success: 200, otherStation: 404 },
  { method: 'GET', pattern: '/api/finance/compensations.csv', access: ['finance'], call: (ctx, scope) => ({ url: `/api/finance/compensations.csv?stationId=${stationOf(ctx, scope)}` }), success: 200, otherStation: 404 },
  { method: 'POST', pattern: '/api/finance/reconciliations', access: ['finance'], call: (ctx, scope) => ({ url: '/api/finance/reconciliations', body: { stationId: stationOf(ctx, scope) } }), success: 202, otherStation: 404 },
  { method: 'GET', pattern: '/api/finance/reconciliations', access: ['finance'], call: () => ({ url: '/api/finance/reconciliations' }), success: 200 },
  { method: 'GET', pattern: '/api/finance/reconciliations/:id', access: ['finance'], call: (ctx, scope) => ({ url: `/api/finance/reconciliations/${scope === 'own' ? ctx.payments.runId : ctx.payments.other.runId}` }), success: 200, otherStation: 404 },
  {
    method: 'POST',
    pattern: '/api/finance/reconciliations/:id/differences/:did/resolve',
    access: ['finance'],
    call: (ctx, scope) => {
      const target = scope === 'own' ? ctx.payments : ctx.payments.other;
      return { url: `/api/finance/reconciliations/${target.runId}/differences/${target.differenceId}/resolve`, body: { note: 'route matrix check' } };
    },
    success: 200,
    otherStation: 404,
  },
  ...ADMIN_ROUTES,
  { method: 'GET', pattern: '/api/finance/report', access: ['finance'], call: (ctx, scope) => ({ url: `/api/finance/report?quarter=2026-Q4&stationId=${stationOf(ctx, scope)}` }), success: 200, otherStation: 404 },
  { method: 'GET', pattern: '/api/finance/report.csv', access: ['finance'], call: (ctx, scope) => ({ url: `/api/finance/report.csv?quarter=2026-Q4&stationId=${stationOf(ctx, scope)}` }), success: 200, otherStation: 404 },
];

export const routeKey = (method: string, pattern: string) => `${method.toUpperCase()} ${pattern}`;
