import type { Role } from '@shared/schemas/common';

/** Each role lands where its day starts. */
export const ROLE_HOME: Record<Role, string> = {
  agent: '/departures',
  supervisor: '/day',
  finance: '/ledger',
  admin: '/setup',
};

export interface NavItem {
  to: string;
  label: string;
  roles: Role[];
}

export const NAV_ITEMS: NavItem[] = [
  { to: '/day', label: 'Station day', roles: ['supervisor'] },
  { to: '/departures', label: 'Departures', roles: ['agent', 'supervisor', 'admin'] },
  { to: '/ledger', label: 'Compensation ledger', roles: ['finance'] },
  { to: '/reconciliation', label: 'Reconciliation', roles: ['finance'] },
  { to: '/report', label: 'Period report', roles: ['finance'] },
  { to: '/planner', label: 'Planner', roles: ['admin', 'supervisor'] },
  { to: '/calibration', label: 'Calibration', roles: ['admin', 'supervisor'] },
  { to: '/setup', label: 'Station setup', roles: ['admin'] },
  { to: '/flights', label: 'Flights', roles: ['admin'] },
  { to: '/schedules', label: 'Schedules', roles: ['admin'] },
  { to: '/manifest', label: 'Manifest import', roles: ['admin'] },
  { to: '/stations', label: 'Stations', roles: ['admin'] },
  { to: '/notices', label: 'Notices', roles: ['supervisor', 'admin'] },
  { to: '/audit', label: 'Audit log', roles: ['admin'] },
];
