import { useState, type FormEvent } from 'react';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { TextAreaField, TextField } from '@/components/ui/field';
import { Notice } from '@/components/ui/notice';
import { describeFailure } from '@/lib/form-errors';
import { useIsClient } from '@/lib/use-is-client';
import type { FieldErrors } from '@/lib/api-client';
import { CONTACT_NEEDED_MESSAGE, NAME_NEEDED_MESSAGE, SERVICE_REQUEST_LIMITS as MAX } from '@shared/schemas/service-request-limits';
import type { ServiceRequestCreatedDto } from '@shared/schemas/service-requests';
import type { RecordSource } from '../api/record-source';
import { useSendServiceRequest } from '../api/send-service-request';

const EMPTY = { contactName: '', contactPhone: '', contactEmail: '', preferredTimes: '', message: '' };
type Fields = typeof EMPTY;

/** The two rules a homeowner most often misses, checked before sending; the server checks everything. */
function missing(f: Fields): FieldErrors {
  const errors: FieldErrors = {};
  if (!f.contactName.trim()) errors.contactName = [NAME_NEEDED_MESSAGE];
  if (!f.contactPhone.trim() && !f.contactEmail.trim()) errors.contactPhone = [CONTACT_NEEDED_MESSAGE];
  return errors;
}

/** "Book your next service": the homeowner asks the company for a visit, from the share page or their own sign-in. */
export function ServiceRequestForm({ source, company }: { source: RecordSource; company: { name: string; phone: string } }) {
  const send = useSendServiceRequest(source);
  const [fields, setFields] = useState<Fields>(EMPTY);
  const [errors, setErrors] = useState<FieldErrors>({});
  const [failure, setFailure] = useState<string | null>(null);
  const [sent, setSent] = useState<ServiceRequestCreatedDto | null>(null);
  // In the server's markup the form waits for the script: typed text would be lost and a submit would reload the page.
  const ready = useIsClient();

  const bind = (name: keyof Fields) => ({
    name,
    value: fields[name],
    maxLength: MAX[name],
    disabled: !ready,
    error: errors[name],
    onChange: (e: { target: { value: string } }) => setFields((f) => ({ ...f, [name]: e.target.value })),
  });

  async function submit(e: FormEvent) {
    e.preventDefault();
    const local = missing(fields);
    setErrors(local);
    setFailure(null);
    if (Object.keys(local).length) return;
    try {
      setSent(await send.mutateAsync(fields));
    } catch (err) {
      const { fields: serverErrors, message } = describeFailure(err);
      setErrors(serverErrors);
      setFailure(message);
    }
  }

  if (sent) {
    return (
      <Card title="Book your next service">
        <div role="status" className="flex flex-col gap-2">
          <p className="text-lg font-semibold">
            We&apos;ve sent your request to {sent.company.name}. They will call or e-mail you.
          </p>
          <p>
            If it can&apos;t wait, call them at{' '}
            <a className="inline-flex min-h-tap items-center font-semibold underline" href={`tel:${sent.company.phone}`}>
              {sent.company.phone}
            </a>
            .
          </p>
        </div>
      </Card>
    );
  }

  return (
    <Card title="Book your next service">
      <form noValidate onSubmit={submit} className="flex flex-col gap-3">
        <p className="text-sm">
          Send {company.name} a request and they will get back to you to set a time. If you smell gas or a carbon monoxide alarm sounds, do not use this
          form: leave the house and call for help from outside.
        </p>
        <TextField label="Your name" autoComplete="name" {...bind('contactName')} />
        <TextField label="Phone" type="tel" inputMode="tel" autoComplete="tel" hint="A phone number or an e-mail address, or both." {...bind('contactPhone')} />
        <TextField label="E-mail" type="email" inputMode="email" autoComplete="email" {...bind('contactEmail')} />
        <TextField label="When suits you (optional)" placeholder="For example: weekday mornings" {...bind('preferredTimes')} />
        <TextAreaField label="Anything they should know (optional)" {...bind('message')} />
        {failure && (
          <Notice kind="caution" title="Not sent yet">
            {failure}
          </Notice>
        )}
        <Button type="submit" className="w-full" disabled={!ready || send.isPending}>
          {send.isPending ? 'Sending…' : 'Send request'}
        </Button>
      </form>
    </Card>
  );
}
