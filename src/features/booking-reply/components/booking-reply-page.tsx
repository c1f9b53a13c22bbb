import { useState, type FormEvent } from 'react';
import { useParams } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { LogoMark } from '@/components/ui/logo-mark';
import { Notice } from '@/components/ui/notice';
import { Spinner, useDocumentTitle } from '@/components/ui/page';
import { TextAreaField, TextField } from '@/components/ui/field';
import { describeFailure } from '@/lib/form-errors';
import type { FieldErrors } from '@/lib/api-client';
import { formatVisitWindow } from '@shared/format/dates';
import { NAME_NEEDED_MESSAGE, SERVICE_REQUEST_LIMITS as MAX } from '@shared/schemas/service-request-limits';
import type { BookingReplyCreatedDto, BookingReplyPageDto } from '@shared/schemas/booking-notices';
import { useBookingReply } from '../api/get-booking-reply';
import { useSendBookingReply } from '../api/send-booking-reply';

const LIMITS = { contactName: MAX.contactName, contactPhone: MAX.contactPhone, reason: MAX.message, preferredTimes: MAX.preferredTimes };
type Fields = Record<keyof typeof LIMITS, string>;

function missing(f: Fields): FieldErrors {
  const errors: FieldErrors = {};
  if (!f.contactName.trim()) errors.contactName = [NAME_NEEDED_MESSAGE];
  if (!f.reason.trim()) errors.reason = ['Tell us why the time does not suit you.'];
  if (!f.preferredTimes.trim()) errors.preferredTimes = ['Give a few times that suit you, like “weekday mornings after 8”.'];
  return errors;
}

function ReplyForm({ token, page }: { token: string; page: BookingReplyPageDto }) {
  const send = useSendBookingReply(token);
  const [fields, setFields] = useState<Fields>({ contactName: page.customerName, contactPhone: '', reason: '', preferredTimes: '' });
  const [errors, setErrors] = useState<FieldErrors>({});
  const [failure, setFailure] = useState<string | null>(null);
  const [sent, setSent] = useState<BookingReplyCreatedDto | null>(null);
  const bind = (name: keyof Fields) => ({
    name,
    value: fields[name],
    maxLength: LIMITS[name],
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
      setSent(await send.mutateAsync({ ...fields, contactPhone: fields.contactPhone.trim() || null }));
    } catch (err) {
      const { fields: serverErrors, message } = describeFailure(err);
      setErrors(serverErrors);
      setFailure(message);
    }
  }

  if (sent) {
    return (
      <p role="status" className="text-lg font-semibold">
        Thank you. {sent.company.name} has your message and will be in touch to find a better time. Until then, the visit stays booked.
      </p>
    );
  }
  return (
    <form noValidate onSubmit={submit} className="flex flex-col gap-3">
      <TextField label="Your name" autoComplete="name" {...bind('contactName')} />
      <TextAreaField label="Why does this time not suit you?" {...bind('reason')} />
      <TextField label="When would suit you?" placeholder="For example: weekday afternoons, or any time on Friday" {...bind('preferredTimes')} />
      <TextField label="Phone (optional)" type="tel" inputMode="tel" autoComplete="tel" hint="So the office can call you back." {...bind('contactPhone')} />
      {failure && (
        <Notice kind="caution" title="Not sent yet">
          {failure}
        </Notice>
      )}
      <Button type="submit" className="w-full" disabled={send.isPending}>
        {send.isPending ? 'Sending…' : 'Send to the office'}
      </Button>
    </form>
  );
}

/** Opened from a booking e-mail without signing in: the homeowner says why the time does not suit and proposes others. */
export function BookingReplyPage() {
  const { token = '' } = useParams();
  const page = useBookingReply(token);
  const b = page.data?.booking;
  useDocumentTitle('Your booked visit');
  return (
    <div className="min-h-screen">
      <header className="bg-header text-header-text">
        <div className="mx-auto flex max-w-2xl items-center gap-2 px-3 py-2">
          <LogoMark />
          <span className="font-bold">Lifeplate</span>
        </div>
      </header>
      <main className="mx-auto flex max-w-2xl flex-col gap-4 px-3 py-6">
        {page.isPending ? (
          <Spinner />
        ) : !page.data || !b ? (
          <>
            <h1 className="text-xl font-bold">This link does not work any more</h1>
            <p>The visit may have been moved, cancelled or already taken place. Call your service company, or use the link in their latest e-mail.</p>
          </>
        ) : (
          <>
            <h1 className="text-xl font-bold">Does this time not suit you?</h1>
            <Card title="Your booked visit">
              <p>
                <strong>{formatVisitWindow(b.startsAt, b.endsAt, b.timeZone)}</strong> at {b.address}. {b.technicianFirstName} from {page.data.company.name} will come.
              </p>
            </Card>
            <p>Tell {page.data.company.name} why, and when would be better. The office will get back to you; until then the visit stays booked.</p>
            <ReplyForm token={token} page={page.data} />
            <p className="text-sm">
              If you smell gas, do not wait for the visit: leave the house and call your gas utility’s emergency number from outside. To talk about the visit, call{' '}
              {page.data.company.name} at{' '}
              <a className="inline-flex min-h-tap items-center font-semibold underline" href={`tel:${page.data.company.phone}`}>
                {page.data.company.phone}
              </a>
              .
            </p>
          </>
        )}
      </main>
    </div>
  );
}
