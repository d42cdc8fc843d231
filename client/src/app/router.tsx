import { lazy, Suspense, type ReactNode } from 'react';
import { createBrowserRouter, Navigate } from 'react-router-dom';
import type { QueryClient } from '@tanstack/react-query';
import type { Role } from '@shared/schemas/common';
import { AppShell } from './layouts/app-shell';
import { RequireSession } from './layouts/require-session';
import { RouteError } from './layouts/route-error';
import { SignInPage } from './routes/sign-in';
import { HomeRedirect } from './routes/home-redirect';
import { NotFoundPage } from './routes/not-found';
import { sessionQueryOptions } from '../lib/session';

const DeparturesPage = lazy(() => import('./routes/departures'));
const StationDayPage = lazy(() => import('./routes/station-day'));
const FlightDeskPage = lazy(() => import('./routes/flight-desk'));
const BumpReviewPage = lazy(() => import('./routes/bump-review'));
const LedgerPage = lazy(() => import('./routes/finance-ledger'));
const ReconciliationPage = lazy(() => import('./routes/finance-reconciliation'));
const ReportPage = lazy(() => import('./routes/finance-report'));
const PlannerPage = lazy(() => import('./routes/planner'));
const SetupPage = lazy(() => import('./routes/setup'));
const CalibrationPage = lazy(() => import('./routes/calibration'));
const OfferYourSeatPage = lazy(() => import('./routes/offer-your-seat'));
const AdminFlightsPage = lazy(() => import('./routes/admin-flights'));
const SchedulesPage = lazy(() => import('./routes/schedules'));
const AdminStationsPage = lazy(() => import('./routes/admin-stations'));
const NoticesPage = lazy(() => import('./routes/notices'));
const AuditLogPage = lazy(() => import('./routes/audit-log'));
const ManifestImportPage = lazy(() => import('./routes/manifest-import'));
const CardDetailsPage = lazy(() => import('./routes/card-details'));
const PayoutPage = lazy(() => import('./routes/payout'));

function guarded(roles: Role[], page: ReactNode) {
  return (
    <RequireSession roles={roles}>
      <Suspense fallback={<p className="p-6 text-ink-soft">Loading…</p>}>{page}</Suspense>
    </RequireSession>
  );
}

export function createAppRouter(queryClient: QueryClient) {
  return createBrowserRouter([
    {
      path: '/',
      element: <AppShell />,
      errorElement: <RouteError />,
      // The session is known before any page draws, so guards never flash the wrong screen.
      loader: () => queryClient.ensureQueryData(sessionQueryOptions()),
      children: [
        { index: true, element: <HomeRedirect /> },
        { path: 'sign-in', element: <SignInPage /> },
        { path: 'departures', element: guarded(['agent', 'supervisor', 'admin'], <DeparturesPage />) },
        { path: 'day', element: guarded(['supervisor'], <StationDayPage />) },
        { path: 'flights/:flightId', element: guarded(['agent', 'supervisor', 'admin'], <FlightDeskPage />) },
        // Supervisors decide; agents and admins follow the review read-only (the page hides what they may not do).
        { path: 'flights/:flightId/bump-review', element: guarded(['agent', 'supervisor', 'admin'], <BumpReviewPage />) },
        { path: 'ledger', element: guarded(['finance'], <LedgerPage />) },
        { path: 'reconciliation', element: guarded(['finance'], <ReconciliationPage />) },
        { path: 'report', element: guarded(['finance'], <ReportPage />) },
        { path: 'planner', element: guarded(['admin', 'supervisor'], <PlannerPage />) },
        { path: 'setup', element: guarded(['admin'], <SetupPage />) },
        { path: 'flights', element: guarded(['admin'], <AdminFlightsPage />) },
        { path: 'schedules', element: guarded(['admin'], <SchedulesPage />) },
        { path: 'stations', element: guarded(['admin'], <AdminStationsPage />) },
        { path: 'notices', element: guarded(['supervisor', 'admin'], <NoticesPage />) },
        { path: 'audit', element: guarded(['admin'], <AuditLogPage />) },
        { path: 'manifest', element: guarded(['admin'], <ManifestImportPage />) },
        { path: 'calibration', element: guarded(['admin', 'supervisor'], <CalibrationPage />) },
        { path: '*', element: <NotFoundPage /> },
      ],
    },
    { path: '/home', element: <Navigate to="/" replace /> },
    // The passenger's page from the gate's QR code: public, outside the staff shell and its session loader.
    {
      path: '/offer/:token',
      errorElement: <RouteError />,
      element: (
        <Suspense fallback={<p className="p-6 text-xl text-ink-soft">Loading…</p>}>
          <OfferYourSeatPage />
        </Suspense>
      ),
    },
    // The passenger's own payment pages from mailed single-use links: public, like the offer page.
    ...[
      { path: '/card/:token', page: <CardDetailsPage /> },
      { path: '/payout/:token', page: <PayoutPage /> },
    ].map(({ path, page }) => ({
      path,
      errorElement: <RouteError />,
      element: <Suspense fallback={<p className="p-6 text-xl text-ink-soft">Loading…</p>}>{page}</Suspense>,
    })),
  ]);
}
