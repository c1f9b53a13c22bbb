import { LABELS } from '@shared/glossary';
import { useState } from 'react';
import type { ImportMapping } from '@shared/imports/import-fields';
import type { ImportFileDto } from '@shared/schemas/imports';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Notice } from '@/components/ui/notice';
import { Page } from '@/components/ui/page';
import { describeFailure } from '@/lib/form-errors';
import { useImport } from '../api/get-import';
import { useImports } from '../api/list-imports';
import { usePreviewImport } from '../api/preview-import';
import { useRunImport } from '../api/run-import';
import { useUploadImport } from '../api/upload-import';
import { ImportPreview } from './import-preview';
import { ImportProgress } from './import-progress';
import { MappingForm } from './mapping-form';

export function ImportsPage() {
  const [fileId, setFileId] = useState<string | null>(null);
  const current = useImport(fileId);
  const recent = useImports();
  return (
    <Page title="Bring records in" subtitle="Customers, sites, appliances, their parts and past visits from a spreadsheet saved as CSV: one row per appliance.">
      <UploadCard onUploaded={(f) => setFileId(f.id)} />
      {current.data && <ImportSteps key={current.data.id} file={current.data} />}
      {recent.data && recent.data.length > 0 && (
        <Card title="Files brought in before">
          <ul className="flex flex-col gap-1 text-sm">
            {recent.data.map((f) => (
              <li key={f.id}>
                <button type="button" className="min-h-tap text-left underline" onClick={() => setFileId(f.id)}>
                  {f.fileName}
                </button>{' '}
                · {f.rowCount} rows · {LABELS.importStatus[f.status]}
              </li>
            ))}
          </ul>
        </Card>
      )}
    </Page>
  );
}

function UploadCard({ onUploaded }: { onUploaded: (file: ImportFileDto) => void }) {
  const upload = useUploadImport();
  const [file, setFile] = useState<File | null>(null);
  const failure = upload.error ? describeFailure(upload.error) : null;
  return (
    <Card title="1. Choose the file">
      <form
        className="flex flex-col gap-3"
        onSubmit={(e) => {
          e.preventDefault();
          if (file) upload.mutate(file, { onSuccess: onUploaded });
        }}
      >
        <label htmlFor="import-file" className="text-sm font-semibold">
          Spreadsheet saved as CSV (up to 20 MB)
        </label>
        <input id="import-file" type="file" accept=".csv,text/csv" className="min-h-tap" onChange={(e) => setFile(e.target.files?.[0] ?? null)} />
        <p className="text-xs text-iron-muted">
          Column names in the first row. Dates as 2004-03-31, 03/31/2004 or Mar 31, 2004. A sample: <a className="underline" href="/import-sample.csv">import-sample.csv</a>.
        </p>
        {failure && <Notice kind="danger">{failure.fields.file?.[0] ?? failure.message}</Notice>}
        <div>
          <Button type="submit" disabled={!file || upload.isPending}>
            {upload.isPending ? 'Reading the file…' : 'Read the file'}
          </Button>
        </div>
      </form>
    </Card>
  );
}

function ImportSteps({ file }: { file: ImportFileDto }) {
  const [mapping, setMapping] = useState<ImportMapping>(file.mapping);
  const preview = usePreviewImport();
  const run = useRunImport();
  const running = file.status === 'queued' || file.status === 'importing';
  const previewFailure = preview.error ? describeFailure(preview.error) : null;
  const runFailure = run.error ? describeFailure(run.error) : null;
  const fieldErrors = { ...(previewFailure?.fields ?? {}), ...(runFailure?.fields ?? {}) };

  return (
    <>
      <Card title={`2. Match the columns of ${file.fileName}`}>
        <p className="mb-3 text-sm text-iron-muted">
          {file.rowCount.toLocaleString('en-US')} rows, {file.headers.length} columns ({file.encoding === 'windows-1252' ? 'read as Windows-1252 text' : 'UTF-8'}). We guessed what we
          could; check each field, and choose the column for the ones we missed. Your choices are remembered for the next file.
        </p>
        <MappingForm
          headers={file.headers}
          mapping={mapping}
          errors={fieldErrors}
          onChange={(next) => {
            setMapping(next);
            // A dry run answers for the mapping it was given: a changed mapping needs a new one.
            preview.reset();
          }}
        />
        {previewFailure && !Object.keys(previewFailure.fields).length && <Notice kind="danger">{previewFailure.message}</Notice>}
        <div className="mt-3">
          <Button variant="secondary" disabled={preview.isPending || running} onClick={() => preview.mutate({ id: file.id, mapping })}>
            {preview.isPending ? 'Checking every row…' : 'Check the file (nothing is written)'}
          </Button>
        </div>
      </Card>
      {preview.data && (
        <>
          <ImportPreview preview={preview.data} />
          <Card title="3. Import">
            {runFailure && <Notice kind="danger">{Object.keys(runFailure.fields).length ? 'Some columns need a look (above).' : runFailure.message}</Notice>}
            {!running && file.status !== 'done' && (
              <Button disabled={run.isPending} onClick={() => run.mutate({ id: file.id, mapping })}>
                {run.isPending ? 'Importing…' : `Import ${(file.rowCount - preview.data.errorRows).toLocaleString('en-US')} rows`}
              </Button>
            )}
          </Card>
        </>
      )}
      {(running || file.status === 'done' || file.status === 'failed') && (
        <Card title="Import">
          <ImportProgress file={file} />
          {file.status === 'done' && (
            <p className="mt-2 text-sm text-iron-muted">Running the same file again adds nothing twice: records already brought in are recognised.</p>
          )}
        </Card>
      )}
    </>
  );
}
