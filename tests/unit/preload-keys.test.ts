import { describe, expect, it } from 'vitest';
import { QueryClient } from '@tanstack/react-query';
import { preloadKeys, preloadScriptTag } from '../../server/spa/preload';
import { sharedRecordQueryOptions } from '@/features/homeowner/api/get-shared-record';
import { applianceRecordQueryOptions } from '@/lib/resources/appliances';
import { meQueryOptions } from '@/lib/auth';

describe('first-screen data embedded in the HTML', () => {
  it('is keyed exactly as the client features query it', () => {
    expect(preloadKeys.share('tok')).toEqual(sharedRecordQueryOptions('tok').queryKey);
    expect(preloadKeys.applianceRecord('a1')).toEqual(applianceRecordQueryOptions('a1').queryKey);
    expect(preloadKeys.me()).toEqual(meQueryOptions().queryKey);
  });

  it('cannot close its script element or open a comment, and reads back to the same data', () => {
    const data = { findings: 'ok </script><script>alert(1)</script> <!-- x', line: 'a\u2028b' };
    const tag = preloadScriptTag([{ key: ['share', 't'], data }]);
    const inner = tag.slice(tag.indexOf('>') + 1, tag.lastIndexOf('</script>'));
    expect(inner).not.toMatch(/<|\u2028/);
    expect(JSON.parse(inner)).toEqual({ queries: [{ key: ['share', 't'], data }] });
    expect(tag.startsWith('<script type="application/json" id="lp-preload">')).toBe(true);
  });

  it('writes nothing when there is no data', () => {
    expect(preloadScriptTag([])).toBe('');
  });

  it('seeds a query client the way the page does', async () => {
    const { seedPreloadedQueries } = await import('@/lib/preload');
    const el = { textContent: JSON.stringify({ queries: [{ key: ['share', 'tok'], data: { appliance: { title: 'Steam boiler' } } }] }) };
    const doc = { getElementById: (id: string) => (id === 'lp-preload' ? el : null) };
    Object.assign(globalThis, { document: doc });
    try {
      const qc = new QueryClient();
      seedPreloadedQueries(qc);
      expect(qc.getQueryData(sharedRecordQueryOptions('tok').queryKey)).toEqual({ appliance: { title: 'Steam boiler' } });
    } finally {
      Reflect.deleteProperty(globalThis, 'document');
    }
  });
});
