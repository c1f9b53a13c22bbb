import type pg from 'pg';
import { completeVisitBody, draftSaveBody, type VisitForCompletion } from '../lib/complete-visit-body';
import { CookieJar } from './cookie-jar';

export type CrewMember = { userId: string; cookie: string };
export type CrewOptions = {
  baseUrl: string;
  crew: CrewMember[];
  applianceIds: readonly string[];
  /** New visits are started until then; a visit under way is still finished. */
  seconds: number;
  savesPerVisit: number;
  /** Pause between one technician's requests, drawn uniformly: a person reading, typing, turning a valve. */
  thinkMs: [number, number];
};
type Visit = VisitForCompletion & { id: string };
export type CrewRun = {
  technicians: number;
  started: string[];
  completed: string[];
  saves: number;
  draftSaveMs: number[];
  errors: string[];
  since: Date;
  wallSeconds: number;
};

const pause = (range: [number, number]) => new Promise((r) => setTimeout(r, range[0] + Math.random() * (range[1] - range[0])));

/** One request as the phone sends it: JSON in, JSON out, the jar's cookies; any answer but 2xx is an error. */
async function call(baseUrl: string, jar: CookieJar, method: string, path: string, body: unknown): Promise<{ visit: Visit | null; error: string | null }> {
  try {
    const res = await fetch(`${baseUrl}${path}`, {
      method,
      headers: { 'content-type': 'application/json', accept: 'application/json', cookie: jar.header() },
      body: JSON.stringify(body),
    });
    jar.take(res);
    const text = await res.text();
    if (res.status < 200 || res.status > 299) return { visit: null, error: `${method} ${path.replace(/[0-9a-f-]{36}/g, ':id')} answered ${res.status} ${text.slice(0, 160)}` };
    return { visit: JSON.parse(text) as Visit, error: null };
  } catch (err) {
    return { visit: null, error: `${method} ${path.replace(/[0-9a-f-]{36}/g, ':id')} failed: ${(err as Error).message}` };
  }
}

/**
 * Technicians working at once, each on their own phone: start a visit on an appliance, save the draft a few times
 * (each save at the revision the last answer gave), complete it in full, and again, until the time is up.
 */
export async function runCrew(opts: CrewOptions): Promise<CrewRun> {
  const since = new Date();
  const run: CrewRun = { technicians: opts.crew.length, started: [], completed: [], saves: 0, draftSaveMs: [], errors: [], since, wallSeconds: 0 };
  const end = Date.now() + opts.seconds * 1000;

  async function technician(member: CrewMember) {
    const jar = new CookieJar(member.cookie);
    while (Date.now() < end) {
      const applianceId = opts.applianceIds[Math.floor(Math.random() * opts.applianceIds.length)];
      const start = await call(opts.baseUrl, jar, 'POST', '/api/visits', { applianceId, type: 'annual_maintenance' });
      if (!start.visit) {
        run.errors.push(start.error!);
        continue;
      }
      let visit = start.visit;
      run.started.push(visit.id);
      let failed = false;
      for (let step = 0; step < opts.savesPerVisit && !failed; step++) {
        await pause(opts.thinkMs);
        const t0 = performance.now();
        const saved = await call(opts.baseUrl, jar, 'PUT', `/api/visits/${visit.id}/draft`, draftSaveBody(visit, step));
        if (!saved.visit) {
          run.errors.push(saved.error!);
          failed = true;
          break;
        }
        run.draftSaveMs.push(performance.now() - t0);
        run.saves += 1;
        visit = { ...saved.visit, id: visit.id };
      }
      if (failed) continue;
      await pause(opts.thinkMs);
      const done = await call(opts.baseUrl, jar, 'POST', `/api/visits/${visit.id}/complete`, completeVisitBody(visit));
      if (done.visit) run.completed.push(visit.id);
      else run.errors.push(done.error!);
      await pause(opts.thinkMs);
    }
  }

  await Promise.all(opts.crew.map(technician));
  run.wallSeconds = (Date.now() - since.getTime()) / 1000;
  return run;
}

export type CrewAudit = { rows: number; completedRows: number; lost: number; duplicated: number; unexpected: number; wrongRevision: number };

/**
 * The stored visits against the answers: every started visit has exactly one row (none lost, none made twice for
 * one start), no row exists that no answer named, every completed one is stored completed with every save in it.
 */
export async function auditCrew(pool: pg.Pool, run: CrewRun, userIds: string[], savesPerVisit: number): Promise<CrewAudit> {
  const { rows } = await pool.query<{ id: string; status: string; revision: number }>(
    'select id, status, revision from visits where created_by = any($1::uuid[]) and created_at >= $2',
    [userIds, run.since],
  );
  const stored = new Map(rows.map((r) => [r.id, r]));
  const started = new Set(run.started);
  const completed = new Set(run.completed);
  const lost = [...started].filter((id) => !stored.has(id)).length + [...completed].filter((id) => stored.get(id)?.status !== 'completed').length;
  return {
    rows: rows.length,
    completedRows: rows.filter((r) => r.status === 'completed').length,
    lost,
    // The same visit answered to two starts would mean two technicians' work landed in one record.
    duplicated: run.started.length - started.size,
    unexpected: rows.filter((r) => !started.has(r.id)).length,
    wrongRevision: [...completed].filter((id) => stored.has(id) && stored.get(id)!.revision !== savesPerVisit + 1).length,
  };
}

export function percentile(values: number[], p: number): number {
  if (!values.length) return Number.NaN;
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)];
}
