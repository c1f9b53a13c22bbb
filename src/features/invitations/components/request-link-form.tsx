import { useState, type FormEvent } from 'react';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { Notice } from '@/components/ui/notice';
import { ApiError } from '@/lib/api-client';
import { requestSignInLink } from '@/lib/auth';
import { welcomePath } from '@shared/schemas/invitations';

/** A fresh sign-in link for this invitation; the server sends one only while the invitation is open for that address. */
export function RequestLinkForm({ invitationId }: { invitationId: string }) {
  const [email, setEmail] = useState('');
  const [error, setError] = useState<string | null>(null);
  const [sent, setSent] = useState(false);
  const [sending, setSending] = useState(false);

  async function submit(e: FormEvent) {
    e.preventDefault();
    if (!/^\S+@\S+\.\S+$/.test(email.trim())) return setError('Enter the address the invitation was sent to.');
    setError(null);
    setSending(true);
    try {
      await requestSignInLink({ email: email.trim(), callbackURL: welcomePath(invitationId), invitationId });
      setSent(true);
    } catch (err) {
      setError(err instanceof ApiError && err.status === 429 ? 'Too many tries. Wait a minute, then try again.' : err instanceof Error ? err.message : 'Not sent.');
    } finally {
      setSending(false);
    }
  }

  if (sent) {
    return (
      <Notice title="Check your e-mail">
        If there is an open invitation for {email.trim()}, a new sign-in link is on its way. Open it on this device.
      </Notice>
    );
  }
  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-3">
      <TextField label="Your e-mail" type="email" autoComplete="email" value={email} onChange={(e) => setEmail(e.target.value)} error={error ?? undefined} />
      <Button type="submit" disabled={sending}>
        {sending ? 'Sending…' : 'Send me a new link'}
      </Button>
    </form>
  );
}
