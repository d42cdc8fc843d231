import { Navigate } from 'react-router-dom';
import { useQuery } from '@tanstack/react-query';
import { sessionQueryOptions } from '../../lib/session';
import { ROLE_HOME } from '../role-homes';

export function HomeRedirect() {
  const { data } = useQuery(sessionQueryOptions());
  return <Navigate to={data?.user ? ROLE_HOME[data.user.role] : '/sign-in'} replace />;
}
