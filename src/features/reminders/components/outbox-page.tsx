import { formatInstant } from '@shared/format/dates';
import { Card } from '@/components/ui/card';
import { Notice } from '@/components/ui/notice';
import { Page, Spinner } from '@/components/ui/page';
import { useOutbox } from '../api/get-outbox';

/** Development only: the mail the local SMTP fake caught for this company, as text and as a sandboxed HTML preview. */
export function OutboxPage() {
  const outbox = useOutbox();
  return (
    <Page title="Outbox (development)" subtitle="E-mail caught by the local mail fake. Nothing here reached a real inbox.">
      <Notice kind="danger" title="These links sign you in as someone else">
        Invitation and sign-in e-mails here carry one-time links. Opening one signs this browser in as the person it was sent to and uses up their
        link. Use them only to try out demo accounts.
      </Notice>
      {outbox.isPending ? (
        <Spinner />
      ) : outbox.error ? (
        <Notice kind="caution" title="No outbox">
          The outbox exists only while the app runs with its local mail fake.
        </Notice>
      ) : !outbox.data.length ? (
        <p>No e-mail yet.</p>
      ) : (
        outbox.data.map((m) => (
          <Card key={m.id} title={m.subject || '(no subject)'}>
            <p className="text-sm text-iron-muted">
              To {m.to.join(', ')} · {formatInstant(m.date, Intl.DateTimeFormat().resolvedOptions().timeZone)}
            </p>
            <details className="mt-2">
              <summary className="min-h-tap cursor-pointer font-semibold">Text part</summary>
              <pre className="whitespace-pre-wrap text-sm">{m.text}</pre>
            </details>
            {m.attachments.map((a) => (
              <details key={a.filename} className="mt-2">
                <summary className="min-h-tap cursor-pointer font-semibold">
                  Attached: {a.filename} ({a.contentType}, {Math.max(1, Math.round(a.size / 1024))} KB)
                </summary>
                {a.text !== null && <pre className="whitespace-pre-wrap text-sm">{a.text}</pre>}
              </details>
            ))}
            {m.html && (
              <details className="mt-2" open>
                <summary className="min-h-tap cursor-pointer font-semibold">HTML part</summary>
                {/* No scripts, no same-origin: the message cannot touch the app or its session. */}
                <iframe title={`HTML preview: ${m.subject}`} sandbox="" srcDoc={m.html} className="h-96 w-full rounded-plate border border-plate-line bg-surface" />
              </details>
            )}
          </Card>
        ))
      )}
    </Page>
  );
}
