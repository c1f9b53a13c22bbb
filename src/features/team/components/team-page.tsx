import { Page, Spinner } from '@/components/ui/page';
import { Card } from '@/components/ui/card';
import { Button } from '@/components/ui/button';
import { StatusBadge } from '@/components/ui/status-badge';
import { Notice } from '@/components/ui/notice';
import { useMe } from '@/lib/auth';
import { can, canManageMemberRole } from '@shared/policy';
import { MEMBER_ROLES, ROLE_LABELS, type MemberRole } from '@shared/schemas/roles';
import { useMembers } from '@/lib/resources/members';
import { useChangeMemberRole, useDeactivateMember } from '../api/update-member';
import { InviteForm } from './invite-form';
import { PendingInvitations } from './pending-invitations';

export function TeamPage() {
  const me = useMe();
  const members = useMembers();
  const changeRole = useChangeMemberRole();
  const deactivate = useDeactivateMember();
  const principal = me.data?.principal;
  const manages = can(principal, 'team:manage');
  const error = changeRole.error ?? deactivate.error;

  return (
    <Page title="Team" subtitle="Everyone who signs in for your company.">
      {error && <Notice kind="danger" title="Not changed">{error.message}</Notice>}
      {manages && principal && <InviteForm principal={principal} />}
      {manages && principal && <PendingInvitations principal={principal} />}
      {members.isPending ? (
        <Spinner />
      ) : (
        <Card>
          <ul className="divide-y divide-plate-line">
            {members.data?.map((m) => {
              const editable = manages && principal && m.userId !== principal.userId && m.active && canManageMemberRole(principal, m.role);
              return (
                <li key={m.id} className="flex flex-wrap items-center gap-3 py-3">
                  <div className="min-w-48 flex-1">
                    <p className="font-semibold">{m.name}</p>
                    <p className="text-sm text-iron-muted">{m.email}</p>
                  </div>
                  {m.active ? <StatusBadge status="ok">Active</StatusBadge> : <StatusBadge status="info">Deactivated</StatusBadge>}
                  {editable ? (
                    <>
                      <label className="sr-only" htmlFor={`role-${m.id}`}>Role for {m.name}</label>
                      <select
                        id={`role-${m.id}`}
                        className="min-h-tap rounded-plate border-2 border-plate-line bg-surface px-2"
                        value={m.role}
                        onChange={(e) => changeRole.mutate({ id: m.id, role: e.target.value as MemberRole })}
                      >
                        {MEMBER_ROLES.filter((r) => canManageMemberRole(principal, m.role, r)).map((r) => (
                          <option key={r} value={r}>{ROLE_LABELS[r]}</option>
                        ))}
                      </select>
                      <Button
                        variant="secondary"
                        onClick={() => {
                          if (confirm(`Deactivate ${m.name}? They are signed out everywhere at once.`)) deactivate.mutate(m.id);
                        }}
                      >
                        Deactivate
                      </Button>
                    </>
                  ) : (
                    <span className="font-semibold">{ROLE_LABELS[m.role]}</span>
                  )}
                </li>
              );
            })}
          </ul>
        </Card>
      )}
    </Page>
  );
}
