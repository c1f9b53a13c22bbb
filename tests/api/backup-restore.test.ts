import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import pg from 'pg';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { LIFE_RECORD_TABLES, lifeRecordChecksums, tableCounts } from '../../scripts/lib/db-contents';
import { readSettings } from '../../scripts/lib/settings';
import { PROJECT_ROOT } from '../../scripts/lib/paths';
import { runMigrations } from '../../server/db/migrate';
import { seedDemo } from '../../server/db/seed/seed-demo';
import { buildWorld } from '../support/authorization/world';
import { testApp } from '../support/context';

// The npm scripts themselves, run against the test cluster as if it were the local one (same data folder and port).
const testDb = new URL(inject('databaseUrl'));
const runDir = inject('runDir');
const suffix = Math.random().toString(36).slice(2, 8);
const SOURCE = `lifeplate_backup_source_${suffix}`;
const RESTORED = `lifeplate_backup_restored_${suffix}`;
const urlOf = (database: string) => Object.assign(new URL(testDb), { pathname: `/${database}` }).toString();
const outDir = path.join(runDir, `backups-${suffix}`);

function npmScript(script: 'db-backup' | 'db-restore', args: string[]) {
  return execFileSync(path.join(PROJECT_ROOT, 'node_modules/.bin/tsx'), [path.join(PROJECT_ROOT, `scripts/${script}.ts`), ...args], {
    env: { ...process.env, DATABASE_URL: '', LIFEPLATE_DATA_DIR: runDir, PG_PORT: testDb.port },
    encoding: 'utf8',
    stdio: ['ignore', 'pipe', 'pipe'],
  });
}

async function admin(sql: string) {
  const client = new pg.Client({ connectionString: urlOf('postgres') });
  await client.connect();
  try {
    await client.query(sql);
  } finally {
    await client.end();
  }
}

beforeAll(async () => {
  // A database of its own with the demo's life records, so other test files' writes cannot move the counts.
  await admin(`create database "${SOURCE}"`);
  await runMigrations(urlOf(SOURCE));
  const source = testApp({ DATABASE_URL: urlOf(SOURCE) });
  try {
    await seedDemo(source.ctx.db);
    // And a company with a record of every kind the API makes: tags, a photo, a share link, a service request.
    await buildWorld(source.ctx, source.app);
  } finally {
    source.ctx.storage.destroy();
    await source.ctx.pool.end();
  }
}, 120_000);
afterAll(async () => {
  for (const database of [SOURCE, RESTORED]) await admin(`drop database if exists "${database}" with (force)`);
  fs.rmSync(outDir, { recursive: true, force: true });
});

describe('backup and restore', () => {
  let file: string;

  it('backs up into the given folder, named for the database and the time', () => {
    const out = npmScript('db-backup', ['--db', SOURCE, '--out', outDir]);
    const files = fs.readdirSync(outDir);
    expect(files).toHaveLength(1);
    expect(files[0]).toMatch(new RegExp(`^${SOURCE}-\\d{8}T\\d{6}Z\\.dump$`));
    file = path.join(outDir, files[0]);
    expect(out).toContain(file);
    expect(fs.readFileSync(file).subarray(0, 5).toString()).toBe('PGDMP');
  }, 60_000);

  it('restores into a new database with every row of every table, and the life records byte for byte', async () => {
    const out = npmScript('db-restore', [file, '--db', RESTORED]);
    expect(out).toContain(`into ${RESTORED}`);
    expect(out).toContain(urlOf(RESTORED));

    const [before, after] = [await tableCounts(urlOf(SOURCE)), await tableCounts(urlOf(RESTORED))];
    expect(after).toEqual(before);
    // The demo has rows in these, so equal checksums are not equal emptiness.
    for (const table of ['customers', 'sites', 'appliances', 'components', 'visits', 'part_swaps', 'timeline_events', 'makeup_water_entries', 'photos', 'tags', 'service_requests']) expect(before[`public.${table}`], table).toBeGreaterThan(0);
    const [sumsBefore, sumsAfter] = [await lifeRecordChecksums(urlOf(SOURCE)), await lifeRecordChecksums(urlOf(RESTORED))];
    expect(sumsAfter).toEqual(sumsBefore);
    const rows = Object.values(after).reduce((a, b) => a + b, 0);
    console.log(
      `[backup and restore] ${Object.keys(after).length} tables, ${rows} rows restored, every count equal; ` +
        `checksums equal for ${LIFE_RECORD_TABLES.length} life-record tables (appliances ${after['public.appliances']}, visits ${after['public.visits']}, ` +
        `timeline events ${after['public.timeline_events']}, part swaps ${after['public.part_swaps']})`,
    );
  }, 120_000);

  it('never restores over an existing database', async () => {
    const counts = await tableCounts(urlOf(RESTORED));
    expect(() => npmScript('db-restore', [file, '--db', RESTORED])).toThrow(/already exists/);
    expect(await tableCounts(urlOf(RESTORED))).toEqual(counts);
  }, 60_000);

  it('refuses a file that is not a dump before making any database', async () => {
    const bogus = path.join(outDir, 'not-a-dump.dump');
    fs.writeFileSync(bogus, 'hello');
    const name = `lifeplate_backup_bogus_${suffix}`;
    expect(() => npmScript('db-restore', [bogus, '--db', name])).toThrow();
    const client = new pg.Client({ connectionString: urlOf('postgres') });
    await client.connect();
    try {
      expect((await client.query('select 1 from pg_database where datname = $1', [name])).rowCount).toBe(0);
    } finally {
      await client.end();
    }
  }, 60_000);

  it('with --use, makes the restored database the one npm start runs on', async () => {
    const name = `lifeplate_backup_used_${suffix}`;
    try {
      const out = npmScript('db-restore', [file, '--db', name, '--use']);
      expect(out).toContain(`npm start now uses ${name}`);
      expect(readSettings(runDir).database).toBe(name);
    } finally {
      fs.rmSync(path.join(runDir, 'settings.json'), { force: true });
      await admin(`drop database if exists "${name}" with (force)`);
    }
  }, 60_000);
});
