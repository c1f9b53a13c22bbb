import { useState, type FormEvent } from 'react';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { SelectField, TextField } from '@/components/ui/field';
import { Notice } from '@/components/ui/notice';
import { invitationMailNotice } from '@/lib/mail-delivery';
import { useValidatedSubmit } from '@/lib/use-validated-submit';
import { canManageMemberRole } from '@shared/policy';
import { memberInvitationInput, type InvitationDto } from '@shared/schemas/invitations';
import { MEMBER_ROLES, ROLE_LABELS, type MemberRole, type Principal } from '@shared/schemas/roles';
import { useInviteMember } from '../api/invite-member';

/** An e-mail with a one-time sign-in link; the person joins when they open it and accept. */
export function InviteForm({ principal }: { principal: Principal }) {
  const invite = useInviteMember();
  const [email, setEmail] = useState('');
  const [role, setRole] = useState<MemberRole>('technician');
  const [sent, setSent] = useState<InvitationDto | null>(null);
  const { errors, failure, saving, formRef, submit } = useValidatedSubmit(memberInvitationInput, async (body) => {
    setSent(null);
    setSent(await invite.mutateAsync(body));
    setEmail('');
  });
  const notice = sent && invitationMailNotice(sent.mail, sent.email);
  const roles = MEMBER_ROLES.filter((r) => canManageMemberRole(principal, r, r)).reverse();

  return (
    <Card title="Invite by e-mail">
      <form
        ref={formRef}
        noValidate
        className="flex flex-col gap-3"
        onSubmit={(e: FormEvent) => {
          e.preventDefault();
          void submit({ email, role });
        }}
      >
        <p className="text-sm text-iron-muted">
          They get an e-mail from Lifeplate with a sign-in link that works once, for 24 hours. The invitation stays open for 7 days.
        </p>
        {failure && <Notice kind="danger" title="Not sent">{failure}</Notice>}
        {notice && <Notice kind={sent?.mail === 'sent' ? 'info' : 'caution'} title={notice.title}>{notice.text}</Notice>}
        <div className="grid gap-3 sm:grid-cols-[2fr_1fr_auto] sm:items-end">
          <TextField label="E-mail" type="email" autoComplete="off" value={email} onChange={(e) => setEmail(e.target.value)} error={errors.email} />
          <SelectField label="Role" value={role} onChange={(e) => setRole(e.target.value as MemberRole)} error={errors.role}>
            {roles.map((r) => (
              <option key={r} value={r}>{ROLE_LABELS[r]}</option>
            ))}
          </SelectField>
          <Button type="submit" disabled={saving}>
            {saving ? 'Sending…' : 'Send invitation'}
          </Button>
        </div>
      </form>
    </Card>
  );
}
