/**
 * Run by import-figure.ts in a process of its own, so its memory is the app's and the import's alone: boots the
 * app, makes a company, imports the file through the service the routes call, prints one JSON line, removes the
 * company again.
 */
import fs from 'node:fs';
import { eq, sql } from 'drizzle-orm';
import { importFiles } from '../../server/db/schema/index';
import { insertCompany } from '../../server/db/factories/companies';
import { insertMember } from '../../server/db/factories/users';
import { SAMPLE_IMPORT_HEADERS, sampleImportRows, toCsv } from '../../server/db/factories/import-csv';
import { importsService } from '../../server/modules/imports/imports.service';
import { runImport } from '../../server/modules/imports/run-import';
import { todayInTimeZone } from '../../shared/dates';
import { bootApp } from './boot';

const kb = (field: string) => Number(new RegExp(`${field}:\\s+(\\d+) kB`).exec(fs.readFileSync('/proc/self/status', 'utf8'))?.[1] ?? 0);

async function main() {
  const { databaseUrl, s3Endpoint, s3Bucket, rows } = JSON.parse(process.argv[2]) as { databaseUrl: string; s3Endpoint: string; s3Bucket: string; rows: number };
  const app = await bootApp({ databaseUrl, s3Endpoint, s3Bucket });
  const { ctx } = app;
  const company = await insertCompany(ctx.db, { name: `Import bench ${Date.now()}` });
  try {
    const manager = await insertMember(ctx.db, { companyId: company.id, role: 'manager' });
    const csv = Buffer.from(toCsv(SAMPLE_IMPORT_HEADERS, sampleImportRows(rows, { seed: 5, today: todayInTimeZone(company.timeZone) })));
    const rssBeforeMb = kb('VmRSS') / 1024;
    const began = performance.now();
    const member = { kind: 'member' as const, userId: manager.user.id, companyId: company.id, role: 'manager' as const };
    const service = importsService(ctx);
    const file = await service.upload(member, { originalname: 'bench.csv', buffer: csv });
    // As the run route does before it starts the run (here awaited, so the time is the whole import).
    await ctx.db.update(importFiles).set({ status: 'queued', mapping: file.mapping }).where(eq(importFiles.id, file.id));
    const outcome = await runImport(ctx, company.id, file.id);
    const seconds = (performance.now() - began) / 1000;
    const done = await service.get(company.id, file.id);
    process.stdout.write(`${JSON.stringify({ outcome, seconds, megabytes: csv.length / 2 ** 20, rssBeforeMb, peakRssMb: kb('VmHWM') / 1024, summary: done.summary })}\n`);
  } finally {
    // Foreign-key triggers off for this one cleanup, as the bench data load does: the cascade through the
    // self-references of components would otherwise scan the 1.8 million parts once per deleted part.
    await ctx.db.transaction(async (tx) => {
      await tx.execute(sql`set local session_replication_role = replica`);
      const tables = await tx.execute<{ table_name: string }>(
        sql`select table_name from information_schema.columns where table_schema = 'public' and column_name = 'company_id' and table_name <> 'companies'`,
      );
      for (const { table_name } of tables.rows) await tx.execute(sql`delete from ${sql.identifier(table_name)} where company_id = ${company.id}`);
      await tx.execute(sql`delete from companies where id = ${company.id}`);
    });
    await app.close();
  }
}

main().then(
  () => process.exit(0),
  (err: unknown) => {
    console.error(err instanceof Error ? (err.stack ?? err.message) : err);
    process.exit(1);
  },
);
