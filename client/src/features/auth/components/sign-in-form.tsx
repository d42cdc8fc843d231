import { useState, type FormEvent } from 'react';
import { signInBodySchema } from '@shared/schemas/auth';
import { ApiRequestError } from '../../../lib/api-client';
import { useSignIn } from '../../../lib/session';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/text-field';

export function SignInForm({ demo, onSignedIn }: { demo: boolean; onSignedIn: () => void }) {
  const [email, setEmail] = useState('');
  const [password, setPassword] = useState('');
  const [fieldErrors, setFieldErrors] = useState<Record<string, string>>({});
  const signIn = useSignIn();

  async function submit(e: FormEvent) {
    e.preventDefault();
    const parsed = signInBodySchema.safeParse({ email, password });
    if (!parsed.success) {
      setFieldErrors(Object.fromEntries(parsed.error.issues.map((i) => [String(i.path[0]), i.message])));
      return;
    }
    setFieldErrors({});
    try {
      await signIn.mutateAsync(parsed.data);
      onSignedIn();
    } catch (err) {
      if (err instanceof ApiRequestError && err.body.details) setFieldErrors(Object.fromEntries(err.body.details.map((d) => [d.field, d.rule])));
    }
  }

  const failure = signIn.error instanceof ApiRequestError && !signIn.error.body.details ? signIn.error.message : null;
  return (
    <form onSubmit={submit} noValidate className="space-y-5" aria-describedby={failure ? 'sign-in-error' : undefined}>
      <TextField label="E-mail" type="email" autoComplete="username" value={email} onChange={setEmail} error={fieldErrors.email} autoFocus />
      <TextField label="Password" type="password" autoComplete="current-password" value={password} onChange={setPassword} error={fieldErrors.password} />
      {failure && (
        <p id="sign-in-error" role="alert" className="rounded-md border-2 border-alert bg-alert-soft px-3 py-2 font-bold text-alert">
          {failure}
        </p>
      )}
      <Button type="submit" className="w-full" disabled={signIn.isPending}>
        {signIn.isPending ? 'Signing in…' : 'Sign in'}
      </Button>
      {demo && (
        <p className="text-sm text-ink-soft">
          Demo data: sign in as <code>agent@</code>, <code>supervisor@</code>, <code>finance@</code> or <code>admin@bumpboard.test</code> with the
          password <code>bumpboard-demo-2026</code>.
        </p>
      )}
    </form>
  );
}
