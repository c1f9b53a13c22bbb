import { useState } from 'react';
import { Link } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import type { TimelineKind } from '@shared/schemas/enums';
import { LABELS, RECORD_SECTIONS } from '@shared/glossary';
import type { TimelineEventDto } from '@shared/schemas/records';
import { useTimeline } from '../api/get-timeline';
import { formatDateTime } from '../lib/labels';
import { Section } from './section';

const KINDS: { kind: TimelineKind; icon: string }[] = [
  { kind: 'visit', icon: '◆' },
  { kind: 'part_swap', icon: '⇄' },
  { kind: 'reading', icon: '◔' },
  { kind: 'install', icon: '+' },
  { kind: 'amendment', icon: '✎' },
  { kind: 'status', icon: '●' },
  { kind: 'note', icon: '✉' },
  { kind: 'photo', icon: '▣' },
  { kind: 'makeup_water', icon: '≈' },
  { kind: 'reminder', icon: '◷' },
  { kind: 'booking', icon: '▦' },
  { kind: 'import', icon: '⇣' },
];
const ICON = Object.fromEntries(KINDS.map((k) => [k.kind, k.icon])) as Record<TimelineKind, string>;
const WORD: Record<TimelineKind, string> = LABELS.timelineKind;

export function Timeline({ applianceId }: { applianceId: string }) {
  const [kind, setKind] = useState<TimelineKind | undefined>(undefined);
  const timeline = useTimeline(applianceId, kind);
  const events = timeline.data?.pages.flatMap((p) => p.items) ?? [];

  return (
    <Section folded title={RECORD_SECTIONS.history}>
      <div role="group" aria-label="Show only" className="-mx-1 mb-2 flex gap-1 overflow-x-auto pb-1">
        <Chip active={kind === undefined} onClick={() => setKind(undefined)}>
          All
        </Chip>
        {KINDS.slice(0, 6).map((k) => (
          <Chip key={k.kind} active={kind === k.kind} onClick={() => setKind(k.kind)}>
            {WORD[k.kind]}
          </Chip>
        ))}
      </div>
      {timeline.isPending && <p role="status">Loading the history…</p>}
      {timeline.isError && <Notice kind="danger" title="History not loaded">{timeline.error.message}</Notice>}
      {timeline.isSuccess && events.length === 0 && <p>{kind ? `No ${WORD[kind].toLowerCase()} recorded.` : 'Nothing recorded yet.'}</p>}
      <ol className="flex flex-col" aria-label="History, newest first">
        {events.map((e) => (
          <EventRow key={e.id} e={e} />
        ))}
      </ol>
      {timeline.hasNextPage && (
        <Button variant="secondary" className="mt-2 w-full" disabled={timeline.isFetchingNextPage} onClick={() => timeline.fetchNextPage()}>
          {timeline.isFetchingNextPage ? 'Loading…' : 'Load older'}
        </Button>
      )}
    </Section>
  );
}

function Chip({ active, onClick, children }: { active: boolean; onClick: () => void; children: string }) {
  return (
    <button
      type="button"
      aria-pressed={active}
      onClick={onClick}
      className={`min-h-tap whitespace-nowrap rounded-full border-2 px-3 font-semibold ${active ? 'border-iron bg-iron text-plate' : 'border-plate-line bg-plate text-iron'}`}
    >
      {children}
    </button>
  );
}

const OPENS_VISIT: TimelineKind[] = ['visit', 'amendment', 'reading'];

function EventRow({ e }: { e: TimelineEventDto }) {
  const body = (
    <>
      <span aria-hidden="true" className="w-6 shrink-0 text-center text-lg">
        {ICON[e.kind]}
      </span>
      <div className="flex min-w-0 flex-col">
        <span className="font-semibold">{e.summary}</span>
        <span className="text-sm text-iron-muted">
          {WORD[e.kind]} · {formatDateTime(e.occurredAt)}
          {e.actorName ? ` · ${e.actorName}` : ''}
        </span>
      </div>
    </>
  );
  return (
    <li className="border-b border-plate-line last:border-b-0" data-kind={e.kind}>
      {e.refId && OPENS_VISIT.includes(e.kind) ? (
        <Link to={`/visits/${e.refId}`} className="flex min-h-tap gap-3 py-2">
          {body}
        </Link>
      ) : (
        <div className="flex gap-3 py-2">{body}</div>
      )}
    </li>
  );
}
