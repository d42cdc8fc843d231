import type { MessageKey } from '@shared/i18n';
import type { Role } from '@shared/schemas/common';

/** Each role lands where its day starts. */
export const ROLE_HOME: Record<Role, string> = {
  agent: '/departures',
  supervisor: '/day',
  finance: '/ledger',
  admin: '/setup',
};

/**
 * Where each role's full list of alerts lives; the alerts bar on every other screen links there. Admins set the
 * station up and work no queue, so they get no bar.
 */
export const ALERT_LISTS: Partial<Record<Role, string>> = {
  agent: '/departures',
  supervisor: '/day',
  finance: '/ledger',
};

export interface NavItem {
  to: string;
  label: string;
  /** The label's message, so a station can show the navigation in another language. */
  labelKey: MessageKey;
  roles: Role[];
}

export const NAV_ITEMS: NavItem[] = [
  { to: '/day', labelKey: 'staff.nav.day', label: 'Station day', roles: ['supervisor'] },
  { to: '/departures', labelKey: 'staff.nav.departures', label: 'Departures', roles: ['agent', 'supervisor', 'admin'] },
  { to: '/ledger', labelKey: 'staff.nav.ledger', label: 'Compensation ledger', roles: ['finance'] },
  { to: '/reconciliation', labelKey: 'staff.nav.reconciliation', label: 'Reconciliation', roles: ['finance'] },
  { to: '/report', labelKey: 'staff.nav.report', label: 'Period report', roles: ['finance'] },
  { to: '/planner', labelKey: 'staff.nav.planner', label: 'Planner', roles: ['admin', 'supervisor'] },
  { to: '/calibration', labelKey: 'staff.nav.calibration', label: 'Calibration', roles: ['admin', 'supervisor'] },
  { to: '/setup', labelKey: 'staff.nav.setup', label: 'Station setup', roles: ['admin'] },
  { to: '/flights', labelKey: 'staff.nav.flights', label: 'Flights', roles: ['admin'] },
  { to: '/schedules', labelKey: 'staff.nav.schedules', label: 'Schedules', roles: ['admin'] },
  { to: '/manifest', labelKey: 'staff.nav.manifest', label: 'Manifest import', roles: ['admin'] },
  { to: '/stations', labelKey: 'staff.nav.stations', label: 'Stations', roles: ['admin'] },
  { to: '/notices', labelKey: 'staff.nav.notices', label: 'Notices', roles: ['supervisor', 'admin'] },
  { to: '/audit', labelKey: 'staff.nav.audit', label: 'Audit log', roles: ['admin'] },
];
