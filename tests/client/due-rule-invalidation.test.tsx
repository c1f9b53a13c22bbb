import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { act, renderHook } from '@testing-library/react';
import type { ReactNode } from 'react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { useUpdateDueRule } from '@/features/catalog/api/update-due-rule';
import { applianceRecordQueryOptions } from '@/lib/resources/appliances';

afterEach(() => vi.unstubAllGlobals());

describe('changing a due rule', () => {
  it('marks an open life record stale, so its due dates are fetched again', async () => {
    vi.stubGlobal('fetch', vi.fn(async () => new Response(JSON.stringify({ id: 'r1' }), { status: 200, headers: { 'Content-Type': 'application/json' } })));
    const qc = new QueryClient({ defaultOptions: { queries: { retry: false, staleTime: Infinity } } });
    // The key the record page and the visit editor read the appliance under.
    const record = applianceRecordQueryOptions('a1').queryKey;
    qc.setQueryData(record, { appliance: { id: 'a1' } } as never);
    const wrapper = ({ children }: { children: ReactNode }) => <QueryClientProvider client={qc}>{children}</QueryClientProvider>;
    const { result } = renderHook(() => useUpdateDueRule(), { wrapper });

    expect(qc.getQueryState(record)?.isInvalidated).toBe(false);
    await act(() => result.current.mutateAsync({ id: 'r1', body: { inspectionIntervalMonths: 12, replacementAgeYears: null, replacementPolicy: 'on_condition', basis: 'manufacturer', source: 'Demo rule' } as never }));
    expect(fetch).toHaveBeenCalledWith('/api/due-rules/r1', expect.objectContaining({ method: 'PUT' }));
    expect(qc.getQueryState(record)?.isInvalidated).toBe(true);
  });
});
