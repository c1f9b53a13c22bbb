import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Notice } from '@/components/ui/notice';
import { StatusBadge } from '@/components/ui/status-badge';
import { canManageMemberRole } from '@shared/policy';
import { ROLE_LABELS, type Principal } from '@shared/schemas/roles';
import { useInvitations } from '../api/get-invitations';
import { useResendInvitation, useRevokeInvitation } from '../api/update-invitation';

/** Invitations nobody has answered yet, with a fresh link or a withdrawal for each. */
export function PendingInvitations({ principal }: { principal: Principal }) {
  const invitations = useInvitations(true);
  const resend = useResendInvitation();
  const revoke = useRevokeInvitation();
  const error = resend.error ?? revoke.error;
  if (!invitations.data?.length) return null;

  return (
    <Card title="Waiting to join">
      {error && <Notice kind="danger" title="Not changed">{error.message}</Notice>}
      {resend.isSuccess &&
        (resend.data.mail === 'sent' ? (
          <Notice title="Sent again">A fresh link is on its way to {resend.data.email}.</Notice>
        ) : (
          <Notice kind="caution" title="Fresh link queued">{`The mail server did not answer. The e-mail to ${resend.data.email} goes out by itself as soon as it does.`}</Notice>
        ))}
      <ul className="divide-y divide-plate-line">
        {invitations.data.map((i) => (
          <li key={i.id} className="flex flex-wrap items-center gap-3 py-3">
            <div className="min-w-48 flex-1">
              <p className="font-semibold break-all">{i.email}</p>
              <p className="text-sm text-iron-muted">
                {ROLE_LABELS[i.role ?? 'technician']}
                {i.invitedByName ? `, invited by ${i.invitedByName}` : ''}
              </p>
            </div>
            {i.status === 'open' ? (
              <StatusBadge status="soon">{`Open until ${i.expiresAt.slice(0, 10)}`}</StatusBadge>
            ) : (
              <StatusBadge status="info">Expired</StatusBadge>
            )}
            {i.mail === 'queued' && <StatusBadge status="soon">E-mail queued</StatusBadge>}
            {i.mail === 'failed' && <StatusBadge status="due">E-mail not sent</StatusBadge>}
            {canManageMemberRole(principal, i.role ?? 'technician') && (
              <>
                <Button variant="secondary" disabled={resend.isPending} onClick={() => resend.mutate(i.id)}>
                  Send again
                </Button>
                <Button
                  variant="ghost"
                  disabled={revoke.isPending}
                  onClick={() => {
                    if (confirm(`Revoke the invitation to ${i.email}? Their link stops working.`)) revoke.mutate(i.id);
                  }}
                >
                  Revoke
                </Button>
              </>
            )}
          </li>
        ))}
      </ul>
    </Card>
  );
}
