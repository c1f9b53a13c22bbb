import { useEffect } from 'react';
import { useNavigate, useParams } from 'react-router-dom';
import { useQuery } from '@tanstack/react-query';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { Page, Spinner } from '@/components/ui/page';
import { ApiError } from '@/lib/api-client';
import { useMe } from '@/lib/auth';
import { can } from '@shared/policy';
import { checkTagCode, formatTagCode } from '@shared/tags/tag-code';
import { publicTagQueryOptions, tagResolutionQueryOptions } from '../api/resolve-tag';
import { AssignFoundTag } from './assign-found-tag';
import { PublicTagInfo } from './public-tag-info';
import { TagFrame } from './tag-frame';

/**
 * Where a scanned tag lands (/t/:code). Kept light for a phone on a weak signal: no schema library, no scanner.
 * Who opens it decides what it shows: the owning company's people go to the record, anyone else learns whose tag it is.
 */
export function TagLandingPage() {
  const { code = '' } = useParams();
  const check = checkTagCode(code);
  return <TagFrame>{check.ok ? <TagLanding code={check.code} /> : <UnknownTag />}</TagFrame>;
}

function TagLanding({ code }: { code: string }) {
  const navigate = useNavigate();
  const me = useMe();
  const signedIn = Boolean(me.data);
  const resolved = useQuery({ ...tagResolutionQueryOptions(code), enabled: signedIn });
  const notTheirs = me.isSuccess && (!signedIn || (resolved.error instanceof ApiError && resolved.error.status === 404));
  const publicInfo = useQuery({ ...publicTagQueryOptions(code), enabled: notTheirs });

  const found = resolved.data;
  const target = !found ? null : 'homeowner' in found ? `/my/${found.applianceId}` : found.status === 'assigned' && found.applianceId ? `/appliances/${found.applianceId}` : null;
  useEffect(() => {
    // Replace: Back from the record returns to where the scan started, not to this hop.
    if (target) navigate(target, { replace: true, state: { fromTag: code } });
  }, [target, code, navigate]);

  if (me.isError) return <Problem error={me.error} onRetry={() => me.refetch()} />;
  if (me.isPending || (signedIn && resolved.isPending) || target) return <Spinner label="Opening the tag…" />;
  if (signedIn && resolved.isError && !notTheirs) return <Problem error={resolved.error} onRetry={() => resolved.refetch()} />;

  if (found && 'status' in found && found.status === 'retired' && found.applianceId) {
    const applianceId = found.applianceId;
    return (
      <Page title={`Tag ${formatTagCode(code)}`}>
        <Notice kind="caution" title="This tag was replaced">
          {found.retiredNote && <p>Note: “{found.retiredNote}”.</p>}
          <p>It still opens the same appliance. If this old tag is still stuck on, take it off so only the new one gets scanned.</p>
        </Notice>
        <Button className="min-h-14 w-full text-xl" onClick={() => navigate(`/appliances/${applianceId}`, { replace: true })}>
          Open the appliance record
        </Button>
      </Page>
    );
  }
  if (found && 'status' in found && found.status === 'unassigned') {
    if (can(me.data?.principal, 'records:write')) return <AssignFoundTag code={code} />;
    return (
      <Page title={`Tag ${formatTagCode(code)}`}>
        <Notice>This tag is not on an appliance yet.</Notice>
      </Page>
    );
  }

  if (publicInfo.isPending) return <Spinner label="Looking up the tag…" />;
  if (publicInfo.isError) return <Problem error={publicInfo.error} onRetry={() => publicInfo.refetch()} />;
  if (!publicInfo.data.known || !publicInfo.data.companyName) return <UnknownTag />;
  const principal = me.data?.principal;
  const viewer =
    principal?.kind === 'member'
      ? ({ kind: 'other-company', ownCompany: me.data?.company?.name ?? null } as const)
      : principal?.kind === 'homeowner'
        ? ({ kind: 'homeowner' } as const)
        : ({ kind: 'signed-out' } as const);
  return <PublicTagInfo code={code} companyName={publicInfo.data.companyName} companyPhone={publicInfo.data.companyPhone} viewer={viewer} />;
}

function UnknownTag() {
  return (
    <Page title="We don't know this tag">
      <p>This code is not one of the tags Lifeplate has made. Check the code printed under the QR.</p>
    </Page>
  );
}

function Problem({ error, onRetry }: { error: Error; onRetry: () => void }) {
  const offline = error instanceof ApiError && error.offline;
  return (
    <Page title="Tag not opened">
      <Notice kind="danger" title={offline ? 'No connection' : 'Something went wrong'}>
        {offline ? 'There is no signal here. Try again near a window or outside.' : error.message}
      </Notice>
      <Button onClick={onRetry}>Try again</Button>
    </Page>
  );
}
