import type { ReactNode } from 'react';
import { Navigate, useLocation } from 'react-router-dom';
import { useQuery } from '@tanstack/react-query';
import type { Role } from '@shared/schemas/common';
import { ROLE_LABELS } from '@shared/schemas/common';
import { sessionQueryOptions } from '../../lib/session';
import { Page } from '../../components/ui/page';

export function RequireSession({ roles, children }: { roles: Role[]; children: ReactNode }) {
  const { data } = useQuery(sessionQueryOptions());
  const location = useLocation();
  const user = data?.user;
  if (!user) return <Navigate to={`/sign-in?next=${encodeURIComponent(location.pathname + location.search)}`} replace />;
  if (!roles.includes(user.role)) {
    return (
      <Page title="Not part of your role">
        <p>
          This screen is for {roles.map((r) => ROLE_LABELS[r].toLowerCase()).join(' and ')} staff. You are signed in as {ROLE_LABELS[user.role].toLowerCase()}.
        </p>
      </Page>
    );
  }
  return <>{children}</>;
}
