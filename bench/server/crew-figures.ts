import pg from 'pg';
import type { BenchFigure } from '../lib/figure';
import type { AppRun } from './app-figures';
import { ensureCrew, signInCrew } from './crew';
import { round, SHARED_CORES_NOTE, type Scale } from './measure';
import { auditCrew, percentile, runCrew } from './technicians';

export type CrewScale = { technicians: number; seconds: number };
export const SAVES_PER_VISIT = 3;
export const FULL_CREW: CrewScale = { technicians: 200, seconds: 60 };
export const QUICK_CREW: CrewScale = { technicians: 10, seconds: 3 };
/** A technician taps save every few seconds; in quick mode the pauses are short so a few seconds see several visits. */
const thinkMs = (scale: Scale): [number, number] => (scale.quick ? [20, 100] : [1000, 3000]);

/** Technicians starting, saving and completing visits at once on random appliances of the large company. */
export async function crewRows(run: AppRun, scale: Scale, crewScale: CrewScale, log: (line: string) => void): Promise<BenchFigure[]> {
  const pool = new pg.Pool({ connectionString: run.databaseUrl, max: 2 });
  try {
    const people = await ensureCrew(pool, run.meta.companyId, crewScale.technicians);
    log(`Signing in ${people.length} technicians…`);
    const crew = await signInCrew(run.baseUrl, people, run.meta.password);
    log(`${crew.length} technicians starting, saving and completing visits for ${crewScale.seconds} s…`);
    const result = await runCrew({ baseUrl: run.baseUrl, crew, applianceIds: run.samples.applianceIds, seconds: crewScale.seconds, savesPerVisit: SAVES_PER_VISIT, thinkMs: thinkMs(scale) });
    const audit = await auditCrew(pool, result, people.map((p) => p.userId), SAVES_PER_VISIT);
    const load = `${crewScale.technicians} technicians, ${crewScale.seconds} s`;
    const wrong = audit.lost + audit.duplicated + audit.unexpected + audit.wrongRevision;
    const distinctErrors = [...new Set(result.errors)].slice(0, 3);
    return [
      {
        figure: 'Concurrent technicians: draft save p99',
        load,
        value: round(percentile(result.draftSaveMs, 99), 0),
        unit: 'ms',
        target: '(reported)',
        met: null,
        note: `p50 ${round(percentile(result.draftSaveMs, 50), 0)} ms, p97.5 ${round(percentile(result.draftSaveMs, 97.5), 0)} ms over ${result.saves} saves; pauses of ${thinkMs(scale).join('–')} ms between a technician's requests; ${SHARED_CORES_NOTE}`,
      },
      {
        figure: 'Concurrent technicians: errors',
        load,
        value: result.errors.length,
        unit: '',
        target: '0',
        met: result.errors.length === 0,
        note: distinctErrors.length ? distinctErrors.join(' | ') : `${result.started.length + result.saves + result.completed.length} requests, all 2xx`,
      },
      {
        figure: 'Concurrent technicians: visits lost or duplicated',
        load,
        value: wrong,
        unit: '',
        target: '0',
        met: wrong === 0,
        note: `${result.started.length} started and ${result.completed.length} completed (2xx answers); ${audit.rows} rows stored, ${audit.completedRows} completed; lost ${audit.lost}, duplicated ${audit.duplicated}, unanswered rows ${audit.unexpected}, saves missing ${audit.wrongRevision}; ran ${round(result.wallSeconds, 1)} s`,
      },
    ];
  } finally {
    await pool.end();
  }
}
