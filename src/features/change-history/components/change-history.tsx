import { useState } from 'react';
import type { InfiniteData, UseInfiniteQueryResult } from '@tanstack/react-query';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { useMe } from '@/lib/auth';
import { Link } from 'react-router-dom';
import { formatCalendarDate, formatInstant } from '@shared/format/dates';
import { can } from '@shared/policy';
import type { ChangeDto, ChangesPageDto } from '@shared/schemas/changes';
import { useApplianceChanges } from '../api/get-appliance-changes';
import { useVisitChanges } from '../api/get-visit-changes';

// Not "History …": the record's folded History is found by that name (substring) in browser tests.
const TITLE = 'Record of changes';

/** The record's history of changes, for owners and managers; nothing at all for anyone else. */
export function ApplianceChanges({ applianceId }: { applianceId: string }) {
  const me = useMe();
  const [open, setOpen] = useState(false);
  const allowed = can(me.data?.principal, 'records:history');
  const changes = useApplianceChanges(applianceId, allowed && open);
  if (!allowed) return null;
  return (
    <Folded
      intro="Every change to this life record, its parts and its visits: who made it and why."
      open={open}
      onToggle={setOpen}
      changes={changes}
      timeZone={me.data?.company?.timeZone ?? 'UTC'}
      showVisit
    />
  );
}

/** One visit's history of changes (its start, sign-off and each amendment with its reason). */
export function VisitChanges({ applianceId, visitId }: { applianceId: string; visitId: string }) {
  const me = useMe();
  const [open, setOpen] = useState(false);
  const allowed = can(me.data?.principal, 'records:history');
  const changes = useVisitChanges(applianceId, visitId, allowed && open);
  if (!allowed) return null;
  return <Folded intro="Every change to this visit: who made it and why." open={open} onToggle={setOpen} changes={changes} timeZone={me.data?.company?.timeZone ?? 'UTC'} />;
}

type FoldedProps = {
  intro: string;
  open: boolean;
  onToggle: (open: boolean) => void;
  changes: UseInfiniteQueryResult<InfiniteData<ChangesPageDto>>;
  timeZone: string;
  /** On the record, each visit's change names its visit and links to it. */
  showVisit?: boolean;
};

function Folded({ intro, open, onToggle, changes, timeZone, showVisit = false }: FoldedProps) {
  const items = changes.data?.pages.flatMap((p) => p.items) ?? [];
  return (
    <section aria-label={TITLE} className="no-print rounded-plate border-2 border-plate-line bg-plate-deep p-3 text-iron">
      <details open={open} onToggle={(e) => onToggle(e.currentTarget.open)}>
        <summary className="flex min-h-tap cursor-pointer flex-wrap content-center items-baseline gap-x-2">
          <h2 className="text-lg font-bold">{TITLE}</h2>
          <span className="text-sm text-iron-muted">office only</span>
        </summary>
        <p className="my-2 text-sm">{intro}</p>
        {changes.isPending && open && <p role="status">Loading the changes…</p>}
        {changes.isError && (
          <Notice kind="danger" title="Changes not loaded">
            {changes.error.message}
          </Notice>
        )}
        {changes.isSuccess && items.length === 0 && <p>No changes recorded yet.</p>}
        <ol className="flex flex-col gap-2" aria-label="Changes, newest first">
          {items.map((c) => (
            <ChangeRow key={c.id} change={c} timeZone={timeZone} showVisit={showVisit} />
          ))}
        </ol>
        {changes.hasNextPage && (
          <Button variant="secondary" className="mt-2 w-full" disabled={changes.isFetchingNextPage} onClick={() => changes.fetchNextPage()}>
            {changes.isFetchingNextPage ? 'Loading…' : 'Load older changes'}
          </Button>
        )}
      </details>
    </section>
  );
}

function ChangeRow({ change, timeZone, showVisit }: { change: ChangeDto; timeZone: string; showVisit: boolean }) {
  return (
    <li className="rounded-plate border-l-4 border-plate-line bg-plate p-2" data-change={change.id}>
      <p className="font-semibold">{change.what}</p>
      {showVisit && change.visit && (
        <Link className="inline-flex min-h-tap items-center text-sm font-semibold underline" to={`/visits/${change.visit.id}`}>
          Visit of {formatCalendarDate(change.visit.visitedOn)}
        </Link>
      )}
      {change.details.length > 0 && (
        <ul className="ml-4 list-disc text-sm">
          {change.details.map((d) => (
            <li key={d}>{d}</li>
          ))}
        </ul>
      )}
      {change.why && (
        <p className="text-sm">
          <span className="font-semibold">Why: </span>
          {change.why}
        </p>
      )}
      <p className="text-sm text-iron-muted">
        {formatInstant(change.at, timeZone)} · {change.who ?? 'nobody signed in (a link or a scheduled task)'}
      </p>
    </li>
  );
}
