import { useState, type FormEvent } from 'react';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { TextField } from '@/components/ui/field';
import { Notice } from '@/components/ui/notice';
import { invitationMailNotice } from '@/lib/mail-delivery';
import { useValidatedSubmit } from '@/lib/use-validated-submit';
import { homeownerInvitationInput, type InvitationDto } from '@shared/schemas/invitations';
import type { CustomerDto } from '@shared/schemas/records';
import { useInviteHomeowner } from '../api/invite-homeowner';

/** E-mails the customer a sign-in link to their own plain-words records, no password needed. */
export function InviteHomeowner({ customer }: { customer: CustomerDto }) {
  const [open, setOpen] = useState(false);
  const [email, setEmail] = useState(customer.email ?? '');
  const [sent, setSent] = useState<InvitationDto | null>(null);
  const invite = useInviteHomeowner();
  const { errors, failure, saving, formRef, submit } = useValidatedSubmit(homeownerInvitationInput, async (body) => {
    setSent(await invite.mutateAsync({ customerId: customer.id, body }));
    setOpen(false);
  });

  const notice = sent && invitationMailNotice(sent.mail, sent.email);
  if (!open) {
    return (
      <div className="flex flex-col gap-2">
        {notice && <Notice kind={sent?.mail === 'sent' ? 'info' : 'caution'} title={notice.title}>{notice.text}</Notice>}
        <div>
          <Button
            variant="secondary"
            onClick={() => {
              setEmail(customer.email ?? '');
              setOpen(true);
            }}
          >
            Invite to sign in
          </Button>
        </div>
      </div>
    );
  }
  return (
    <Card title="Invite the homeowner to sign in">
      <form
        ref={formRef}
        noValidate
        className="flex flex-col gap-3"
        onSubmit={(e: FormEvent) => {
          e.preventDefault();
          void submit({ email });
        }}
      >
        <p className="text-sm text-iron-muted">
          They get an e-mail with a link that signs them in without a password and shows their appliances in plain words, without office notes.
        </p>
        {failure && <Notice kind="danger" title="Not sent">{failure}</Notice>}
        <TextField label="Their e-mail" type="email" autoComplete="off" value={email} onChange={(e) => setEmail(e.target.value)} error={errors.email} />
        <div className="flex flex-wrap gap-2">
          <Button type="submit" disabled={saving}>
            {saving ? 'Sending…' : 'Send invitation'}
          </Button>
          <Button variant="ghost" onClick={() => setOpen(false)}>
            Cancel
          </Button>
        </div>
      </form>
    </Card>
  );
}
