import { useState, type FormEvent } from 'react';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { Notice } from '@/components/ui/notice';
import { ApiError } from '@/lib/api-client';
import { requestSignInLink } from '@/lib/auth';

/** For people with no password (most homeowners): a one-time link by e-mail that signs them in and opens `next`. */
export function SignInLinkForm({ next }: { next: string }) {
  const [email, setEmail] = useState('');
  const [error, setError] = useState<string | null>(null);
  const [sentTo, setSentTo] = useState<string | null>(null);
  const [sending, setSending] = useState(false);

  async function submit(e: FormEvent) {
    e.preventDefault();
    const address = email.trim();
    if (!/^\S+@\S+\.\S+$/.test(address)) return setError('Enter the e-mail address your service company has for you.');
    setError(null);
    setSending(true);
    try {
      await requestSignInLink({ email: address, callbackURL: next, errorCallbackURL: '/sign-in?link=failed' });
      setSentTo(address);
    } catch (err) {
      setError(err instanceof ApiError && err.status === 429 ? 'Too many tries. Wait a minute, then try again.' : err instanceof Error ? err.message : 'Not sent.');
    } finally {
      setSending(false);
    }
  }

  if (sentTo) {
    return (
      <Notice title="Check your e-mail">
        If {sentTo} may sign in to Lifeplate, a sign-in link is on its way. It works once, for 24 hours.
      </Notice>
    );
  }
  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-4">
      <TextField label="E-mail" type="email" autoComplete="email" value={email} onChange={(e) => setEmail(e.target.value)} error={error ?? undefined} />
      <Button type="submit" disabled={sending}>
        {sending ? 'Sending…' : 'E-mail me a sign-in link'}
      </Button>
    </form>
  );
}
