import type { Tx } from '../client';

/** The life-record part of the demo (customers, sites, appliances, histories) is filled in by the life-record work. */
export async function seedDemoRecords(
  _tx: Tx,
  _ids: { demoCompanyId: string; otherCompanyId: string; homeownerCustomerId: string; userIds: Record<string, string> },
) {}
