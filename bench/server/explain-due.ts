import type pg from 'pg';
import { addDays } from '../../shared/trade/iso-date';
import type { Db } from '../../server/db/client';
import { companyToday } from '../../server/core/company-today';
import { dueRepository } from '../../server/modules/due/due.repository';

type PlanNode = { 'Node Type': string; 'Relation Name'?: string; 'Index Name'?: string; 'Actual Rows'?: number; 'Sort Key'?: string[]; Plans?: PlanNode[] };

export type DuePlanReport = {
  topNode: string;
  usesIndexScan: boolean;
  fullTableSort: boolean;
  seqScans: string[];
  executionMs: number;
  text: string;
};

const walk = (node: PlanNode, out: PlanNode[] = []) => {
  out.push(node);
  for (const child of node.Plans ?? []) walk(child, out);
  return out;
};

/**
 * EXPLAIN (ANALYZE, BUFFERS) of the due list's first page, on the SQL dueRepository.listDue builds (.toSQL()).
 * "Full-table sort": a Sort node fed by more rows than the page, i.e. the order does not come from an index.
 */
export async function explainDueQuery(db: Db, pool: pg.Pool, companyId: string, withinDays: number, limit: number): Promise<DuePlanReport> {
  const through = addDays(await companyToday(db, companyId), withinDays);
  const query = dueRepository.listDue(db, { companyId, through, after: null, limit: limit + 1 }).toSQL();
  const json = await pool.query<{ 'QUERY PLAN': [{ Plan: PlanNode; 'Execution Time': number }] }>(`explain (analyze, buffers, format json) ${query.sql}`, query.params);
  const text = await pool.query<{ 'QUERY PLAN': string }>(`explain (analyze, buffers) ${query.sql}`, query.params);
  const [{ Plan: plan, 'Execution Time': executionMs }] = json.rows[0]['QUERY PLAN'];
  const nodes = walk(plan);
  const topNode = [plan['Node Type'], plan.Plans?.[0] ? `→ ${plan.Plans[0]['Node Type']}` : ''].join(' ').trim();
  const usesIndexScan = nodes.some((n) => /Index/.test(n['Node Type']) && n['Relation Name'] === 'components');
  const fullTableSort = nodes.some((n) => n['Node Type'] === 'Sort' && (n.Plans?.[0]?.['Actual Rows'] ?? 0) > limit + 1);
  const seqScans = nodes.filter((n) => n['Node Type'] === 'Seq Scan').map((n) => n['Relation Name'] ?? '?');
  return { topNode, usesIndexScan, fullTableSort, seqScans, executionMs, text: text.rows.map((r) => r['QUERY PLAN']).join('\n') };
}
