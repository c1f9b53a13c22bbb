import pg from 'pg';
import type { BenchFigure } from '../lib/figure';
import type { AppRun } from './app-figures';
import { latencyAt, percentileRow, type Scale } from './measure';

/** The part type with the most parts in the fleet: the heaviest learned-life curve to compute. */
async function busiestPartType(run: AppRun): Promise<{ typeCode: string; parts: number }> {
  const pool = new pg.Pool({ connectionString: run.databaseUrl, max: 1 });
  try {
    const { rows } = await pool.query<{ type_code: string; parts: number }>(
      'select type_code, count(*)::int as parts from components where company_id = $1 group by type_code order by count(*) desc, type_code limit 1',
      [run.meta.companyId],
    );
    if (!rows[0]) throw new Error('The bench data set has no components.');
    return { typeCode: rows[0].type_code, parts: rows[0].parts };
  } finally {
    await pool.end();
  }
}

/** The learned-life fleet query (Kaplan–Meier survival curve over every part of one type): GET /api/service-life?type=. */
export async function serviceLifeRows(run: AppRun, scale: Scale): Promise<BenchFigure[]> {
  const { typeCode, parts } = await busiestPartType(run);
  const load = await latencyAt(scale, run.baseUrl, run.cookie, () => `/api/service-life?type=${encodeURIComponent(typeCode)}`, 5);
  const row = percentileRow(`Learned service life, one part type's fleet curve: p99`, '5 req/s', load, 500, `${typeCode}, ${parts} parts in ${run.meta.appliances} appliances`);
  return [
    {
      figure: `Learned service life, one part type's fleet curve: p50`,
      load: '5 req/s',
      value: load.p50,
      unit: 'ms',
      target: 'p50 ≤ 500 ms',
      met: !load.failed && load.p50 <= 500,
      note: row.note,
    },
    row,
  ];
}
