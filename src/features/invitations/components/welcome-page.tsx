import { Link, useLocation, useParams } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { Spinner } from '@/components/ui/page';
import { ApiError } from '@/lib/api-client';
import { useMe, useSignOut } from '@/lib/auth';
import { welcomePath } from '@shared/schemas/invitations';
import { useInvitation } from '../api/get-invitation';
import { AcceptInvitation, invitationTitle } from './accept-invitation';
import { RequestLinkForm } from './request-link-form';
import { WelcomeFrame } from './welcome-frame';

const CLOSED = {
  expired: ['This invitation has expired', 'Ask the company to send you a new one.'],
  revoked: ['This invitation was withdrawn', 'The company withdrew it. Ask them if you think that is a mistake.'],
} as const;

/** Where an invitation's e-mailed link lands, already signed in by the link. */
export function WelcomePage() {
  const { invitationId = '' } = useParams();
  const linkFailed = new URLSearchParams(useLocation().search).has('error');
  const me = useMe();
  const signOut = useSignOut();
  const invitation = useInvitation(invitationId, Boolean(me.data));

  if (me.isPending || (me.data && invitation.isPending)) return <Spinner />;

  if (!me.data) {
    return (
      <WelcomeFrame title={linkFailed ? 'This sign-in link has expired' : 'Open your invitation'}>
        <p>
          {linkFailed
            ? 'Each link works once, for 24 hours. Type the address the invitation was sent to and we will e-mail you a new one.'
            : 'Type the address the invitation was sent to and we will e-mail you a sign-in link.'}
        </p>
        <RequestLinkForm invitationId={invitationId} />
        <p className="text-sm">
          Have a password already?{' '}
          <Link className="font-semibold underline" to={`/sign-in?next=${encodeURIComponent(welcomePath(invitationId))}`}>
            Sign in with it
          </Link>
        </p>
      </WelcomeFrame>
    );
  }

  if (invitation.isError) {
    const notYours = invitation.error instanceof ApiError && (invitation.error.status === 404 || invitation.error.status === 400);
    return (
      <WelcomeFrame title={notYours ? 'This invitation is for someone else' : 'Could not open the invitation'}>
        <p>
          {notYours
            ? `You are signed in as ${me.data.user.email}, and this invitation was sent to another address. Sign out, then open the link from your e-mail again.`
            : invitation.error.message}
        </p>
        {notYours && (
          <Button variant="secondary" disabled={signOut.isPending} onClick={() => signOut.mutate()}>
            Sign out
          </Button>
        )}
      </WelcomeFrame>
    );
  }

  const i = invitation.data!;
  if (i.status === 'accepted') {
    return (
      <WelcomeFrame title="You are all set">
        <p>This invitation has been accepted.</p>
        <Link className="flex min-h-tap items-center font-semibold underline" to="/">
          Go to Lifeplate
        </Link>
      </WelcomeFrame>
    );
  }
  if (i.status !== 'open') {
    return (
      <WelcomeFrame title={CLOSED[i.status][0]}>
        <Notice kind="caution">{CLOSED[i.status][1]}</Notice>
      </WelcomeFrame>
    );
  }
  return (
    <WelcomeFrame title={invitationTitle(i)}>
      <AcceptInvitation invitation={i} />
    </WelcomeFrame>
  );
}
