import { todayInTimeZone } from '@shared/dates';
import { formatCalendarDate } from '@shared/format/dates';
import { useState } from 'react';
import { Link } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { useMe } from '@/lib/auth';
import { can } from '@shared/policy';
import { formatTagCode } from '@shared/tags/tag-code';
import { useAssignTag } from '../api/assign-tag';
import { useApplianceTags } from '../api/get-appliance-tags';
import { AssignError, REPLACE_EXPLAINED } from './assign-error';
import { TagCodeForm } from './tag-code-form';

const linkButton =
  'inline-flex min-h-tap w-full items-center justify-center rounded-plate border border-plate-line bg-surface px-4 text-base font-semibold text-iron hover:bg-brass-light';
const formatDay = (iso: string) => formatCalendarDate(todayInTimeZone(Intl.DateTimeFormat().resolvedOptions().timeZone, new Date(iso)));

/** The record's tag section: which tag is on the appliance, and attaching or replacing one. */
export function ApplianceTag({ applianceId }: { applianceId: string }) {
  const me = useMe();
  const tags = useApplianceTags(applianceId);
  const assign = useAssignTag();
  const [mode, setMode] = useState<'idle' | 'attach' | 'replace'>('idle');
  const [lastCode, setLastCode] = useState<string | null>(null);
  const canWrite = can(me.data?.principal, 'records:write');
  const current = tags.data?.find((t) => t.status === 'assigned') ?? null;
  const retired = tags.data?.filter((t) => t.status === 'retired') ?? [];

  function attach(code: string, replaceDamaged: boolean) {
    setLastCode(code);
    assign.mutate({ code, applianceId, replaceDamaged }, { onSuccess: () => setMode('idle') });
  }
  function close() {
    assign.reset();
    setMode('idle');
  }

  return (
    <section className="flex flex-col gap-2 rounded-plate border-2 border-plate-line bg-plate-deep p-3 text-iron" aria-label="Tag">
      <h2 className="text-lg font-bold">Tag</h2>
      {tags.isPending && <p className="text-iron-muted">Loading the tag…</p>}
      {tags.isError && <p role="alert" className="text-due">{tags.error.message}</p>}
      {tags.isSuccess &&
        (current ? (
          <p>
            Tag <strong className="font-mono text-xl tracking-wider">{formatTagCode(current.code)}</strong>
            {current.assignedAt && <span className="text-iron-muted"> · attached {formatDay(current.assignedAt)}</span>}
          </p>
        ) : (
          <p className="font-semibold">No tag yet</p>
        ))}
      {retired.length > 0 && (
        <p className="text-sm text-iron-muted">
          Earlier {retired.length === 1 ? 'tag' : 'tags'}, still opening this record:{' '}
          {retired.map((t) => `${formatTagCode(t.code)}${t.retiredNote ? ` (${t.retiredNote})` : ''}`).join(', ')}
        </p>
      )}

      {canWrite && tags.isSuccess && mode === 'idle' && (
        <Button variant="secondary" className="w-full sm:w-auto" onClick={() => setMode(current ? 'replace' : 'attach')}>
          {current ? 'Replace a damaged tag' : 'Attach a tag'}
        </Button>
      )}
      {mode === 'replace' && current && (
        <Notice kind="caution" title={`Replace tag ${formatTagCode(current.code)}?`}>
          Only when it is damaged, unreadable or lost. {REPLACE_EXPLAINED}
        </Notice>
      )}
      {mode !== 'idle' && (
        <div className="flex flex-col gap-2">
          <TagCodeForm
            label={mode === 'replace' ? 'New tag code' : 'Tag code'}
            submitLabel={mode === 'replace' ? 'Replace the tag' : 'Attach this tag'}
            busy={assign.isPending}
            onSubmit={(code) => attach(code, mode === 'replace')}
          />
          {assign.isError && <AssignError error={assign.error} busy={assign.isPending} onReplace={lastCode ? () => attach(lastCode, true) : undefined} />}
          <Link to={`/scan?assignTo=${applianceId}${mode === 'replace' ? '&replace=1' : ''}`} className={linkButton}>
            {mode === 'replace' ? 'Scan the new tag instead' : 'Scan the tag instead'}
          </Link>
          <Button variant="ghost" onClick={close}>
            Cancel
          </Button>
        </div>
      )}
    </section>
  );
}
