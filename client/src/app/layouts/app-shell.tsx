import { useEffect } from 'react';
import { NavLink, Outlet, useLocation, useNavigate } from 'react-router-dom';
import { useQuery } from '@tanstack/react-query';
import { ROLE_LABELS } from '@shared/schemas/common';
import { useT } from '../../lib/language';
import { sessionQueryOptions, useSignOut } from '../../lib/session';
import { onUnauthenticated } from '../../lib/api-client';
import { AlertsBar } from '../../features/alerts/components/alerts-bar';
import { ALERT_LISTS, NAV_ITEMS } from '../role-homes';
import { STATION_PARAM, useCurrentStation } from '../use-current-station';
import { useQueryClient } from '@tanstack/react-query';

export function AppShell() {
  const { data: session } = useQuery(sessionQueryOptions());
  const user = session?.user ?? null;
  const signOut = useSignOut();
  const navigate = useNavigate();
  const location = useLocation();
  const qc = useQueryClient();
  const t = useT();
  const { station, stations, choose, inUrl } = useCurrentStation();

  // The station belongs in the URL: a page opened without one (or with one the user does not belong to) gets the
  // working station written in, so the picker, the page and a copied link all name the same station.
  useEffect(() => {
    if (user && station && !inUrl && !location.pathname.startsWith('/sign-in')) choose(station.id, true);
  }, [user, station, inUrl, choose, location.pathname]);

  // A session that expires mid-work sends the user to sign in, remembering the page to come back to.
  useEffect(
    () =>
      onUnauthenticated(() => {
        qc.setQueryData(sessionQueryOptions().queryKey, (s) => (s ? { ...s, user: null } : s));
        if (!location.pathname.startsWith('/sign-in')) navigate(`/sign-in?next=${encodeURIComponent(location.pathname + location.search)}&expired=1`);
      }),
    [navigate, location, qc],
  );

  return (
    <div className="min-h-screen">
      <a href="#main" className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:bg-signal focus:p-2">
        {t('staff.skip')}
      </a>
      <header className="no-print on-dark bg-harbour text-white">
        <div className="mx-auto flex max-w-7xl flex-wrap items-center gap-x-6 gap-y-2 px-4 py-3">
          <span className="flex items-center gap-2 text-2xl font-bold tracking-tight">
            <span aria-hidden className="inline-block h-6 w-6 rounded bg-signal" />
            Bumpboard
          </span>
          {user && (
            <nav aria-label={t('staff.nav.label')} className="flex flex-wrap gap-1">
              {NAV_ITEMS.filter((i) => i.roles.includes(user.role)).map((i) => (
                <NavLink key={i.to} to={station ? `${i.to}?${STATION_PARAM}=${station.iata}` : i.to} className={({ isActive }) => `rounded px-3 py-2 font-bold ${isActive ? 'bg-white text-harbour' : 'hover:bg-white/15'}`}>
                  {t(i.labelKey)}
                </NavLink>
              ))}
            </nav>
          )}
          {user && (
            <div className="ml-auto flex flex-wrap items-center gap-3">
              {stations.length > 1 ? (
                <label className="flex items-center gap-2">
                  <span className="text-sm">{t('staff.station')}</span>
                  <select data-testid="station-picker" className="rounded bg-white px-2 py-1 font-bold text-harbour" value={station?.id ?? ''} onChange={(e) => choose(Number(e.target.value))}>
                    {stations.map((s) => (
                      <option key={s.id} value={s.id}>
                        {s.iata} · {s.name}
                      </option>
                    ))}
                  </select>
                </label>
              ) : (
                station && <span className="font-bold">{station.iata}</span>
              )}
              <span className="text-sm">
                {user.displayName} · {ROLE_LABELS[user.role]}
              </span>
              <button type="button" className="rounded border-2 border-white px-3 py-1 font-bold hover:bg-white hover:text-harbour" onClick={() => signOut.mutate(undefined, { onSettled: () => navigate('/sign-in') })}>
                {t('staff.signOut')}
              </button>
            </div>
          )}
        </div>
        {session?.demo && (
          <p className="bg-signal px-4 py-1 text-center text-sm font-bold text-ink">{t('staff.demo')}</p>
        )}
      </header>
      {user && ALERT_LISTS[user.role] && (
        <AlertsBar
          stationId={user.role === 'finance' ? null : (station?.id ?? null)}
          listPath={station ? `${ALERT_LISTS[user.role]}?${STATION_PARAM}=${station.iata}` : ALERT_LISTS[user.role]!}
          showPanel={!Object.values(ALERT_LISTS).includes(location.pathname) && !location.pathname.startsWith('/sign-in')}
          linkFlights={user.role !== 'finance'}
        />
      )}
      <main id="main">
        <Outlet />
      </main>
    </div>
  );
}
