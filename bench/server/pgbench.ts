import { spawn } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { findPgBin } from '../../scripts/lib/postgres';
import { appliancesRepository } from '../../server/modules/appliances/appliances.repository';
import { listTimeline } from '../../server/core/timeline';
import { capturingDb, inlineParams } from './capture-sql';

/**
 * A pgbench script that sends the SQL the timeline route sends (the appliance check, then the first page),
 * captured from the repository functions, for a random appliance of the large company per transaction.
 * The ids are the generator's seeded ones, so pgbench can make one from a random number.
 */
export async function timelinePgbenchScript(databaseUrl: string, opts: { companyId: string; seed: number; appliances: number; sampleId: string }) {
  const { db, captured, close } = capturingDb(databaseUrl);
  try {
    await appliancesRepository.find(db, opts.companyId, opts.sampleId);
    await listTimeline(db, { companyId: opts.companyId, applianceId: opts.sampleId, limit: 50 });
  } finally {
    await close();
  }
  // pg_temp.uid of the generator, spelled without ':' inside literals (pgbench would read ':a' as a variable).
  const key = `concat_ws(chr(58), '${Math.trunc(opts.seed)}', '0', 'a', cast(:n as text))`;
  const applianceId = `overlay(overlay(md5(${key}) placing '4' from 13) placing 'a' from 17)::uuid`;
  const lines = captured.map((q) => `${inlineParams(q, (v) => (v === opts.sampleId ? applianceId : undefined)).replace(/\s+/g, ' ')};`);
  return [`\\set n random(1, ${opts.appliances})`, ...lines].join('\n') + '\n';
}

export async function runPgbench(databaseUrl: string, script: string, opts: { clients: number; seconds: number }): Promise<number> {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'lifeplate-pgbench-'));
  const file = path.join(dir, 'timeline.sql');
  fs.writeFileSync(file, script);
  try {
    // -T includes opening the connections (seconds for 50 on a busy machine); tps is reported without that time.
    const args = ['-n', '-M', 'prepared', '-c', String(opts.clients), '-j', '2', '-T', String(opts.seconds + 5), '-f', file, databaseUrl];
    const out = await new Promise<string>((resolve, reject) => {
      const child = spawn(path.join(findPgBin(), 'pgbench'), args, { stdio: ['ignore', 'pipe', 'pipe'] });
      let stdout = '';
      let stderr = '';
      child.stdout.on('data', (d: Buffer) => (stdout += d.toString()));
      child.stderr.on('data', (d: Buffer) => (stderr += d.toString()));
      child.on('error', reject);
      child.on('close', (code) => (code === 0 ? resolve(stdout) : reject(new Error(`pgbench exited ${code}: ${stderr || stdout}`))));
    });
    const match = /tps = ([\d.]+) \(without initial connection time\)/.exec(out);
    if (/aborted/i.test(out)) throw new Error(`pgbench aborted:\n${out}`);
    if (!match || Number(match[1]) === 0) throw new Error(`pgbench measured nothing:\n${out}`);
    return Number(match[1]);
  } finally {
    fs.rmSync(dir, { recursive: true, force: true });
  }
}
