import { useState, type FormEvent } from 'react';
import { Navigate, useLocation, useNavigate } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { LogoMark } from '@/components/ui/logo-mark';
import { Notice } from '@/components/ui/notice';
import { ApiError } from '@/lib/api-client';
import { useMe, useSignIn } from '@/lib/auth';
import { SignInLinkForm } from './sign-in-link-form';

export function SignInPage() {
  const me = useMe();
  const signIn = useSignIn();
  const navigate = useNavigate();
  const location = useLocation();
  const params = new URLSearchParams(location.search);
  const next = params.get('next') ?? '/';
  const linkFailed = params.get('link') === 'failed';
  const [byLink, setByLink] = useState(linkFailed);
  const [email, setEmail] = useState('');
  const [password, setPassword] = useState('');
  const [errors, setErrors] = useState<{ email?: string; password?: string; form?: string }>({});

  if (me.data) return <Navigate to={next.startsWith('/') ? next : '/'} replace />;

  async function submit(e: FormEvent) {
    e.preventDefault();
    const found: typeof errors = {};
    if (!/^\S+@\S+\.\S+$/.test(email)) found.email = 'Enter the e-mail address you sign in with.';
    if (!password) found.password = 'Enter your password.';
    setErrors(found);
    if (Object.keys(found).length) return;
    try {
      await signIn.mutateAsync({ email, password });
      navigate(next.startsWith('/') ? next : '/', { replace: true });
    } catch (err) {
      const message =
        err instanceof ApiError && err.status === 429
          ? // The per-address lock says how long; the per-client limit does not.
            err.code === 'too_many_attempts'
            ? err.message
            : 'Too many tries. Wait a minute, then try again.'
          : err instanceof ApiError && err.status === 401
            ? 'That e-mail and password do not match.'
            : err instanceof Error
              ? err.message
              : 'Sign-in failed.';
      setErrors({ form: message });
    }
  }

  return (
    <main className="mx-auto flex min-h-screen max-w-sm flex-col justify-center gap-6 px-4">
      <div className="flex items-center gap-3">
        <LogoMark className="h-12 w-12" />
        <div>
          <p className="text-2xl font-bold">Lifeplate</p>
          <p className="text-iron-muted">The life record of every boiler you look after.</p>
        </div>
      </div>
      <form onSubmit={submit} noValidate className="flex flex-col gap-4 rounded-plate border border-plate-line bg-surface p-5">
        <h1 className="text-xl font-semibold">Sign in</h1>
        {errors.form && <Notice kind="danger" title="Not signed in">{errors.form}</Notice>}
        <TextField label="E-mail" type="email" autoComplete="username" value={email} onChange={(e) => setEmail(e.target.value)} error={errors.email} />
        <TextField
          label="Password"
          type="password"
          autoComplete="current-password"
          value={password}
          onChange={(e) => setPassword(e.target.value)}
          error={errors.password}
        />
        <Button type="submit" disabled={signIn.isPending}>
          {signIn.isPending ? 'Signing in…' : 'Sign in'}
        </Button>
      </form>
      <section className="flex flex-col gap-4 rounded-plate border border-plate-line bg-surface p-5">
        <h2 className="text-lg font-semibold">No password?</h2>
        {linkFailed && <Notice kind="caution" title="That sign-in link did not work">Each link works once, for 24 hours. Ask for a new one below.</Notice>}
        {byLink ? (
          <SignInLinkForm next={next.startsWith('/') ? next : '/'} />
        ) : (
          <Button variant="secondary" onClick={() => setByLink(true)}>
            E-mail me a sign-in link
          </Button>
        )}
      </section>
    </main>
  );
}
