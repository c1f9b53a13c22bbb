import { useCallback, useRef, useState } from 'react';
import { Link, useNavigate, useSearchParams } from 'react-router-dom';
import { Notice } from '@/components/ui/notice';
import { Page, Spinner } from '@/components/ui/page';
import { ApiError } from '@/lib/api-client';
import { formatTagCode } from '@shared/tags/tag-code';
import { useAssignTag } from '../api/assign-tag';
import { getPublicTag, resolveTag } from '../api/resolve-tag';
import { readScannedText } from '../lib/scanned-tag';
import { AssignError } from './assign-error';
import { PhotoDecode } from './photo-decode';
import { QrScanner } from './qr-scanner';
import { TagCodeForm } from './tag-code-form';

type Outcome =
  | { kind: 'checking'; code: string }
  | { kind: 'other-company'; code: string; companyName: string }
  | { kind: 'unknown'; code: string }
  | { kind: 'not-a-tag'; text: string }
  | { kind: 'other-site'; host: string }
  | { kind: 'failed'; message: string };

/**
 * The in-app scanner. Opening a tag goes through /t/<code>, which decides what the person sees; with
 * ?assignTo=<applianceId> (from the record's tag section) the scanned tag is attached to that appliance instead.
 */
export function ScanPage() {
  const navigate = useNavigate();
  const [params] = useSearchParams();
  const assignTo = params.get('assignTo');
  const replaceDamaged = params.get('replace') === '1';
  const assign = useAssignTag();
  const [outcome, setOutcome] = useState<Outcome | null>(null);
  const [lastCode, setLastCode] = useState<string | null>(null);
  const busy = useRef(false);

  const attach = useCallback(
    (code: string, replace: boolean) => {
      if (!assignTo) return;
      setLastCode(code);
      assign.mutate({ code, applianceId: assignTo, replaceDamaged: replace }, { onSuccess: () => navigate(`/appliances/${assignTo}`, { replace: true }) });
    },
    [assign, assignTo, navigate],
  );

  const openCode = useCallback(
    async (code: string) => {
      if (busy.current) return;
      if (assignTo) {
        attach(code, replaceDamaged);
        return;
      }
      busy.current = true;
      setOutcome({ kind: 'checking', code });
      try {
        await resolveTag(code);
        navigate(`/t/${code}`);
      } catch (error) {
        setOutcome(await explainUnopened(code, error));
      } finally {
        busy.current = false;
      }
    },
    [assignTo, attach, navigate, replaceDamaged],
  );

  const onText = useCallback(
    (text: string) => {
      const scanned = readScannedText(text, window.location.origin);
      if (scanned.kind === 'tag') void openCode(scanned.code);
      else if (scanned.kind === 'other-site') setOutcome({ kind: 'other-site', host: scanned.host });
      else setOutcome({ kind: 'not-a-tag', text });
    },
    [openCode],
  );

  return (
    <Page
      title={assignTo ? (replaceDamaged ? 'Scan the new tag' : 'Scan the tag to attach') : 'Scan a tag'}
      subtitle={assignTo ? (replaceDamaged ? 'It replaces the damaged tag on this appliance.' : 'It will be attached to the appliance you came from.') : undefined}
    >
      {assignTo && (
        <Link to={`/appliances/${assignTo}`} className="inline-flex min-h-tap items-center font-semibold underline">
          Back to the appliance
        </Link>
      )}
      <QrScanner onText={onText} />
      <div aria-live="polite">
        {assign.isPending && <Spinner label="Attaching the tag…" />}
        {assign.isError && <AssignError error={assign.error} busy={assign.isPending} onReplace={lastCode ? () => attach(lastCode, true) : undefined} />}
        {outcome && <OutcomeNotice outcome={outcome} />}
      </div>
      <section aria-label="No luck with the camera?" className="flex flex-col gap-3 rounded-plate border-2 border-plate-line bg-plate-deep p-3">
        <h2 className="text-lg font-bold">No luck with the camera?</h2>
        <TagCodeForm submitLabel={assignTo ? 'Attach this tag' : 'Open this tag'} busy={assign.isPending || outcome?.kind === 'checking'} onSubmit={openCode} />
        <PhotoDecode onText={onText} />
      </section>
    </Page>
  );
}

async function explainUnopened(code: string, error: unknown): Promise<Outcome> {
  if (!(error instanceof ApiError) || error.status !== 404) return { kind: 'failed', message: failure(error) };
  try {
    const info = await getPublicTag(code);
    return info.known && info.companyName ? { kind: 'other-company', code, companyName: info.companyName } : { kind: 'unknown', code };
  } catch (publicError) {
    return { kind: 'failed', message: failure(publicError) };
  }
}

function failure(error: unknown) {
  if (error instanceof ApiError && error.offline) return 'No connection, so the tag could not be looked up. Try again when you have signal.';
  return error instanceof Error ? error.message : 'The tag could not be looked up.';
}

function OutcomeNotice({ outcome }: { outcome: Outcome }) {
  switch (outcome.kind) {
    case 'checking':
      return <Spinner label={`Opening tag ${formatTagCode(outcome.code)}…`} />;
    case 'other-company':
      return (
        <Notice kind="caution" title="This tag belongs to another company">
          Tag {formatTagCode(outcome.code)} is kept by {outcome.companyName}. Its record is not in your company&apos;s records.
        </Notice>
      );
    case 'unknown':
      return (
        <Notice kind="caution" title="We don't know this tag">
          Tag {formatTagCode(outcome.code)} is not one of the tags Lifeplate has made.
        </Notice>
      );
    case 'other-site':
      return (
        <Notice kind="caution" title="Not a tag from this Lifeplate">
          This QR code points to {outcome.host}, not to this site, so it is not opened here.
        </Notice>
      );
    case 'not-a-tag':
      return (
        <Notice kind="caution" title="This QR code is not a Lifeplate tag">
          It reads: “{outcome.text.length > 80 ? `${outcome.text.slice(0, 80)}…` : outcome.text}”. Look for the tag with the code printed under the QR.
        </Notice>
      );
    case 'failed':
      return (
        <Notice kind="danger" title="Tag not opened">
          {outcome.message}
        </Notice>
      );
  }
}
