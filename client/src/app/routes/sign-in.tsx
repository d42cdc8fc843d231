import { Navigate, useNavigate, useSearchParams } from 'react-router-dom';
import { useQuery } from '@tanstack/react-query';
import { sessionQueryOptions } from '../../lib/session';
import { SignInForm } from '../../features/auth/components/sign-in-form';
import { ROLE_HOME } from '../role-homes';
import { useArrival } from '../../components/ui/use-arrival';

function safeNext(next: string | null) {
  // Only paths inside this app: never an open redirect to another site.
  return next && next.startsWith('/') && !next.startsWith('//') ? next : null;
}

export function SignInPage() {
  const { data } = useQuery(sessionQueryOptions());
  const [params] = useSearchParams();
  const navigate = useNavigate();
  const next = safeNext(params.get('next'));
  const heading = useArrival('Sign in');
  if (data?.user) return <Navigate to={next ?? ROLE_HOME[data.user.role]} replace />;
  return (
    <div className="mx-auto mt-12 max-w-md px-4">
      <div className="rounded-lg border-2 border-line bg-card p-6 shadow-sm">
        <h1 ref={heading} tabIndex={-1} className="text-3xl font-bold text-harbour">
          Sign in
        </h1>
        <p className="mb-5 mt-1 text-ink-soft">Gate-day console for oversold flights.</p>
        {params.get('expired') && (
          <p role="status" className="mb-4 rounded-md bg-watch-soft px-3 py-2">
            Your session ended. Sign in again to go back where you were.
          </p>
        )}
        <SignInForm demo={Boolean(data?.demo)} onSignedIn={() => navigate(next ?? '/', { replace: true })} />
      </div>
    </div>
  );
}
