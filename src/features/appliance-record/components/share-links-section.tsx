import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { StatusBadge } from '@/components/ui/status-badge';
import { ApiError } from '@/lib/api-client';
import { useCreateShareLink, useRevokeShareLink, useShareLinks } from '../api/share-links';
import { Section } from './section';
import { RECORD_SECTIONS } from '@shared/glossary';
import { todayInTimeZone } from '@shared/dates';
import { formatCalendarDate } from '@shared/format/dates';

const STATUS = { active: ['ok', 'Active'], expired: ['info', 'Expired'], revoked: ['info', 'Revoked'] } as const;

/** Links that let the homeowner read this record without an account; the full link is shown once, when made. */
export function ShareLinksSection({ applianceId, canRevoke, timeZone }: { applianceId: string; canRevoke: boolean; timeZone: string }) {
  const links = useShareLinks(applianceId);
  const create = useCreateShareLink(applianceId);
  const revoke = useRevokeShareLink(applianceId);
  const [label, setLabel] = useState('');
  const [days, setDays] = useState('365');
  const [copied, setCopied] = useState(false);
  const activeCount = links.data?.filter((l) => l.status === 'active').length;
  const details = create.error instanceof ApiError ? create.error.details : undefined;

  return (
    <Section title={RECORD_SECTIONS.share} folded summary={activeCount === undefined ? undefined : activeCount ? `${activeCount} active ${activeCount === 1 ? 'link' : 'links'}` : 'no active link'}>
      <p className="mb-2 text-sm">
        A share link lets the owner read this record in plain words, without an account. It shows no office notes. Anyone holding the link can open
        it, so send it only to the owner.
      </p>
      <div className="grid gap-2 sm:grid-cols-3 sm:items-end">
        <TextField label="Label (optional)" placeholder="e.g. sent by text to the owner" value={label} onChange={(e) => setLabel(e.target.value)} error={details?.label} />
        <TextField label="Expires after (days)" inputMode="numeric" value={days} onChange={(e) => setDays(e.target.value)} error={details?.expiresInDays} />
        <Button
          disabled={create.isPending}
          onClick={() => {
            setCopied(false);
            create.mutate({ label: label || null, expiresInDays: Number(days) });
          }}
        >
          Make a share link
        </Button>
      </div>
      {create.data && (
        <div className="mt-3 rounded-plate border-2 border-ok bg-ok-soft p-3" role="status">
          <p className="text-sm font-semibold">New link (shown once; copy it now):</p>
          <p className="break-all font-mono text-sm" data-testid="new-share-link">
            {create.data.url}
          </p>
          <Button
            variant="secondary"
            className="mt-2"
            onClick={async () => {
              await navigator.clipboard?.writeText(create.data.url).catch(() => {});
              setCopied(true);
            }}
          >
            {copied ? 'Copied' : 'Copy link'}
          </Button>
        </div>
      )}
      {links.data && links.data.length > 0 && (
        <ul className="mt-3 flex flex-col gap-2">
          {links.data.map((l) => (
            <li key={l.id} className="flex flex-wrap items-center gap-2 border-b border-plate-line pb-2 text-sm">
              <StatusBadge status={STATUS[l.status][0]}>{STATUS[l.status][1]}</StatusBadge>
              <span>{l.label ?? 'Share link'}</span>
              <span className="text-iron-muted">until {formatCalendarDate(todayInTimeZone(timeZone, new Date(l.expiresAt)))}</span>
              {canRevoke && l.status === 'active' && (
                <Button variant="ghost" className="ml-auto" onClick={() => revoke.mutate(l.id)}>
                  Revoke
                </Button>
              )}
            </li>
          ))}
        </ul>
      )}
    </Section>
  );
}
