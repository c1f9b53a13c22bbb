import { and, desc, eq, lt, or } from 'drizzle-orm';
import type { DbOrTx } from '../db/client';
import { timelineEvents, users } from '../db/schema/index';
import type { TimelineKind } from '../../shared/schemas/enums';
import type { TimelineEventDto } from '../../shared/schemas/records';

export type NewTimelineEvent = {
  companyId: string;
  applianceId: string;
  occurredAt: Date;
  kind: TimelineKind;
  summary: string;
  refId?: string | null;
  data?: Record<string, unknown>;
  homeownerVisible?: boolean;
  actorId?: string | null;
};

/** Append-only: call it inside the transaction that writes the record the event describes. */
export async function appendTimelineEvent(db: DbOrTx, event: NewTimelineEvent) {
  await db.insert(timelineEvents).values(event);
}

const encodeCursor = (occurredAt: Date, id: number) => `${occurredAt.toISOString()}_${id}`;
function decodeCursor(cursor: string): { occurredAt: Date; id: number } | null {
  const [iso, id] = cursor.split('_');
  const occurredAt = new Date(iso);
  return Number.isNaN(occurredAt.getTime()) || !/^\d+$/.test(id ?? '') ? null : { occurredAt, id: Number(id) };
}

/** Newest first, paged by keyset on (occurred_at, id): never by offset. */
export async function listTimeline(
  db: DbOrTx,
  q: { companyId: string; applianceId: string; kind?: TimelineKind; before?: string; limit: number; homeownerOnly?: boolean },
) {
  const cursor = q.before ? decodeCursor(q.before) : null;
  const rows = await db
    .select({
      id: timelineEvents.id,
      occurredAt: timelineEvents.occurredAt,
      kind: timelineEvents.kind,
      summary: timelineEvents.summary,
      refId: timelineEvents.refId,
      data: timelineEvents.data,
      actorName: users.name,
    })
    .from(timelineEvents)
    .leftJoin(users, eq(users.id, timelineEvents.actorId))
    .where(
      and(
        eq(timelineEvents.companyId, q.companyId),
        eq(timelineEvents.applianceId, q.applianceId),
        q.kind ? eq(timelineEvents.kind, q.kind) : undefined,
        q.homeownerOnly ? eq(timelineEvents.homeownerVisible, true) : undefined,
        cursor
          ? or(
              lt(timelineEvents.occurredAt, cursor.occurredAt),
              and(eq(timelineEvents.occurredAt, cursor.occurredAt), lt(timelineEvents.id, cursor.id)),
            )
          : undefined,
      ),
    )
    .orderBy(desc(timelineEvents.occurredAt), desc(timelineEvents.id))
    .limit(q.limit + 1);
  const page = rows.slice(0, q.limit);
  const last = page[page.length - 1];
  const items: TimelineEventDto[] = page.map((r) => ({ ...r, occurredAt: r.occurredAt.toISOString() }));
  return { items, nextCursor: rows.length > q.limit && last ? encodeCursor(last.occurredAt, last.id) : null };
}

