import { useState, type FormEvent } from 'react';
import { useNavigate } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { Notice } from '@/components/ui/notice';
import { describeFailure } from '@/lib/form-errors';
import type { InviteeInvitationDto } from '@shared/schemas/invitations';
import { ROLE_LABELS } from '@shared/schemas/roles';
import { useAcceptInvitation } from '../api/accept-invitation';

export const invitationTitle = (i: InviteeInvitationDto) =>
  i.kind === 'member' ? `Join ${i.companyName} as ${ROLE_LABELS[i.role ?? 'technician'].toLowerCase()}` : "See your boiler's record";

export function AcceptInvitation({ invitation }: { invitation: InviteeInvitationDto }) {
  const accept = useAcceptInvitation();
  const navigate = useNavigate();
  const [name, setName] = useState('');
  const [errors, setErrors] = useState<Record<string, string[]>>({});
  const [failure, setFailure] = useState<string | null>(null);

  async function submit(e: FormEvent) {
    e.preventDefault();
    if (invitation.needsName && !name.trim()) return setErrors({ name: ['Enter your name, as your team will see it.'] });
    setErrors({});
    setFailure(null);
    try {
      await accept.mutateAsync({ id: invitation.id, body: { name: name.trim() || undefined } });
      // Home shows each person their own start: the team's search, or the homeowner's appliances.
      navigate('/', { replace: true });
    } catch (err) {
      const { fields, message } = describeFailure(err);
      setErrors(fields);
      setFailure(message);
    }
  }

  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-4">
      {invitation.kind === 'member' ? (
        <p>
          {invitation.companyName} uses Lifeplate to keep the life record of every boiler they look after. Accept to join their team.
        </p>
      ) : (
        <p>
          {invitation.companyName} keeps a record of the heating equipment they look after for you: each visit, the parts they replaced and what is due
          next. Accept to see it here whenever you like.
        </p>
      )}
      {failure && <Notice kind="danger" title="Not accepted">{failure}</Notice>}
      {invitation.needsName && (
        <TextField label="Your name" autoComplete="name" value={name} onChange={(e) => setName(e.target.value)} error={errors.name} />
      )}
      <Button type="submit" disabled={accept.isPending}>
        {accept.isPending ? 'Accepting…' : invitation.kind === 'member' ? 'Join the team' : 'See my record'}
      </Button>
    </form>
  );
}
