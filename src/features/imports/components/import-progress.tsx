import type { ImportFileDto } from '@shared/schemas/imports';
import { Notice } from '@/components/ui/notice';
import { errorsCsvUrl } from '../api/run-import';
import { CountsTable } from './import-preview';

/** The run's progress while it goes, and what it did once it is done. */
export function ImportProgress({ file }: { file: ImportFileDto }) {
  if (file.status === 'queued' || file.status === 'importing') {
    return (
      <div className="flex flex-col gap-2">
        <label htmlFor="import-progress" className="font-semibold">
          Importing {file.fileName}: {file.rowsDone.toLocaleString('en-US')} of {file.rowCount.toLocaleString('en-US')} rows
        </label>
        <progress id="import-progress" className="h-4 w-full" max={file.rowCount} value={file.rowsDone} />
        <p className="text-sm text-iron-muted">You can leave this page; the import carries on and this page shows it when you come back.</p>
      </div>
    );
  }
  if (file.status === 'failed') return <Notice kind="danger" title="The import stopped">{file.failure ?? 'Run it again to finish; nothing is imported twice.'}</Notice>;
  if (file.status !== 'done' || !file.summary) return null;
  const s = file.summary;
  return (
    <div className="flex flex-col gap-3">
      <Notice kind="done" title="Import finished">
        {file.fileName}: {s.rows.toLocaleString('en-US')} rows read in {s.seconds} s. {s.appliances.create} appliances, {s.customers.create} customers and {s.visits.create} past visits
        added; due dates recomputed.
        {s.errorRows > 0 && ` ${s.errorRows} row${s.errorRows === 1 ? ' was' : 's were'} left out.`}
      </Notice>
      <CountsTable counts={s} caption="What the import did" />
      {s.errorRows > 0 && (
        <p>
          <a className="font-semibold underline" href={errorsCsvUrl(file.id)} download>
            Download the {s.errorRows} row{s.errorRows === 1 ? '' : 's'} to fix
          </a>{' '}
          (a CSV with a column saying what to fix; upload it again when fixed).
        </p>
      )}
    </div>
  );
}
