import { useEffect, useState } from 'react';
import { useSearchParams } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { Page, Spinner } from '@/components/ui/page';
import { describeFailure } from '@/lib/form-errors';
import { useMe } from '@/lib/auth';
import { can } from '@shared/policy';
import { SERVICE_REQUEST_STATUS_LABELS, SERVICE_REQUEST_STATUSES } from '@shared/schemas/service-requests';
import { useServiceRequests, type ServiceRequestFilter } from '../api/list-service-requests';
import { useUpdateServiceRequest } from '../api/update-service-request';
import { ServiceRequestCard } from './service-request-card';

const FILTERS: { value: ServiceRequestFilter; label: string }[] = [
  ...SERVICE_REQUEST_STATUSES.map((s) => ({ value: s, label: SERVICE_REQUEST_STATUS_LABELS[s] })),
  { value: 'all', label: 'All' },
];
const isFilter = (v: string | null): v is ServiceRequestFilter => FILTERS.some((f) => f.value === v);

/** Homeowners' requests for a visit, newest first; the office marks each scheduled or closed. */
export function ServiceRequestsPage() {
  const [params, setParams] = useSearchParams();
  const linked = params.get('request');
  const asked = params.get('status');
  // A link from the office e-mail shows every status, so the request is there even if someone already handled it.
  const filter: ServiceRequestFilter = isFilter(asked) ? asked : linked ? 'all' : 'new';
  const list = useServiceRequests(filter);
  const update = useUpdateServiceRequest();
  const canBook = can(useMe().data?.principal, 'bookings:manage');
  const [failure, setFailure] = useState<string | null>(null);
  const items = list.data?.pages.flatMap((p) => p.items) ?? [];

  useEffect(() => {
    if (linked && items.some((i) => i.id === linked)) document.getElementById(`request-${linked}`)?.scrollIntoView({ block: 'center' });
  }, [linked, items.length]); // eslint-disable-line react-hooks/exhaustive-deps

  async function setStatus(id: string, status: 'scheduled' | 'closed') {
    setFailure(null);
    try {
      await update.mutateAsync({ id, status });
    } catch (err) {
      setFailure(describeFailure(err).message);
    }
  }

  return (
    <Page title="Service requests" subtitle="Homeowners asking to book a visit, from a share link or their own sign-in.">
      <div role="group" aria-label="Show" className="flex flex-wrap gap-2">
        {FILTERS.map((f) => (
          <Button
            key={f.value}
            variant={f.value === filter ? 'primary' : 'secondary'}
            aria-pressed={f.value === filter}
            onClick={() => setParams(f.value === 'new' ? {} : { status: f.value })}
          >
            {f.label}
          </Button>
        ))}
      </div>
      {failure && (
        <Notice kind="caution" title="Not changed">
          {failure}
        </Notice>
      )}
      {list.isPending ? (
        <Spinner />
      ) : list.error ? (
        <Notice kind="caution" title="Could not load the requests">
          {describeFailure(list.error).message}
        </Notice>
      ) : items.length ? (
        <ul className="flex flex-col gap-3">
          {items.map((r) => (
            <ServiceRequestCard
              key={r.id}
              request={r}
              highlighted={r.id === linked}
              busy={update.isPending && update.variables?.id === r.id}
              onStatus={(status) => setStatus(r.id, status)}
              canBook={canBook}
            />
          ))}
        </ul>
      ) : (
        <p>{filter === 'new' ? 'No new requests.' : 'No requests here.'}</p>
      )}
      {list.hasNextPage && (
        <Button variant="secondary" disabled={list.isFetchingNextPage} onClick={() => list.fetchNextPage()}>
          {list.isFetchingNextPage ? 'Loading…' : 'Show older requests'}
        </Button>
      )}
    </Page>
  );
}
