import { todayInTimeZone } from '@shared/dates';
import { formatCalendarDate } from '@shared/format/dates';
import { useState, type FormEvent } from 'react';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { TextField } from '@/components/ui/field';
import { Notice } from '@/components/ui/notice';
import { Page, Spinner } from '@/components/ui/page';
import type { FieldErrors } from '@/lib/api-client';
import { describeFailure, zodFieldErrors } from '@/lib/form-errors';
import { MAX_TAGS_PER_BATCH, TAG_FORMAT_IDS, tagBatchInput, type TagBatchDto, type TagFormatId } from '@shared/schemas/tags';
import { useCreateTagBatch } from '../api/create-tag-batch';
import { tagBatchPdfUrl, useTagBatches } from '../api/list-tag-batches';
import { TAG_FORMAT_LABELS } from '../lib/tag-formats';

const pdfLink =
  'inline-flex min-h-tap items-center justify-center rounded-plate border border-plate-line bg-plate-deep px-4 text-base font-semibold text-iron hover:bg-brass-light';
const formatDay = (iso: string) => formatCalendarDate(todayInTimeZone(Intl.DateTimeFormat().resolvedOptions().timeZone, new Date(iso)));

/** The office prints tags here: make a batch of new codes, download its sheet, see how many are on appliances. */
export function TagBatchesPage() {
  const batches = useTagBatches();
  return (
    <Page title="Tags" subtitle="Print QR tags for appliances. A tag opens the appliance's life record when scanned.">
      <NewBatchForm />
      <TagGuidance />
      <Card title="Batches">
        {batches.isPending && <Spinner label="Loading batches…" />}
        {batches.isError && <p role="alert" className="text-due">{batches.error.message}</p>}
        {batches.data?.length === 0 && <p className="text-iron-muted">No tags made yet.</p>}
        {batches.data && batches.data.length > 0 && (
          <ul className="flex flex-col divide-y divide-plate-line" aria-label="Tag batches">
            {batches.data.map((b) => (
              <BatchRow key={b.id} batch={b} />
            ))}
          </ul>
        )}
      </Card>
    </Page>
  );
}

function BatchRow({ batch }: { batch: TagBatchDto }) {
  return (
    <li className="flex flex-wrap items-center justify-between gap-2 py-3">
      <div>
        <p className="font-semibold">
          {batch.count} {batch.count === 1 ? 'tag' : 'tags'} · {TAG_FORMAT_LABELS[batch.format]}
        </p>
        <p className="text-sm text-iron-muted">
          Made {formatDay(batch.createdAt)}
          {batch.createdByName ? ` by ${batch.createdByName}` : ''} · {batch.assignedCount} of {batch.count} on appliances
        </p>
      </div>
      <a href={tagBatchPdfUrl(batch.id)} target="_blank" rel="noreferrer" className={pdfLink}>
        Download PDF
      </a>
    </li>
  );
}

function NewBatchForm() {
  const create = useCreateTagBatch();
  const [count, setCount] = useState('30');
  const [format, setFormat] = useState<TagFormatId>('sheet_1x2_625');
  const [errors, setErrors] = useState<FieldErrors>({});
  const [failure, setFailure] = useState<string | null>(null);

  function submit(e: FormEvent) {
    e.preventDefault();
    setFailure(null);
    const parsed = tagBatchInput.safeParse({ count: count.trim() === '' ? undefined : count.trim(), format });
    if (!parsed.success) {
      setErrors(zodFieldErrors(parsed.error));
      return;
    }
    setErrors({});
    create.mutate(parsed.data, {
      onError: (err) => {
        const { fields, message } = describeFailure(err);
        setErrors(fields);
        setFailure(message);
      },
    });
  }

  return (
    <Card title="Make tags">
      <form onSubmit={submit} noValidate className="flex flex-col gap-3">
        <TextField
          label="How many tags"
          inputMode="numeric"
          value={count}
          onChange={(e) => setCount(e.target.value)}
          error={errors.count}
          hint={`1 to ${MAX_TAGS_PER_BATCH}. Each tag gets its own code; a full sheet holds 30.`}
        />
        <fieldset className="flex flex-col gap-1">
          <legend className="text-sm font-semibold">Label format</legend>
          {TAG_FORMAT_IDS.map((id) => (
            <label key={id} className="flex min-h-tap items-center gap-2">
              <input type="radio" name="format" value={id} checked={format === id} onChange={() => setFormat(id)} className="h-5 w-5" />
              {TAG_FORMAT_LABELS[id]}
            </label>
          ))}
          {errors.format?.map((m) => (
            <p key={m} role="alert" className="text-sm font-semibold text-due">
              ⚠ {m}
            </p>
          ))}
        </fieldset>
        {failure && (
          <Notice kind="danger" title="Tags not made">
            {failure}
          </Notice>
        )}
        <Button type="submit" disabled={create.isPending} className="w-full sm:w-auto">
          {create.isPending ? 'Making tags…' : 'Make tags'}
        </Button>
        {create.isSuccess && (
          <Notice title={`Made ${create.data.count} new ${create.data.count === 1 ? 'tag' : 'tags'}`}>
            <a href={tagBatchPdfUrl(create.data.id)} target="_blank" rel="noreferrer" className="font-semibold underline">
              Download the PDF to print
            </a>
          </Notice>
        )}
      </form>
    </Card>
  );
}

function TagGuidance() {
  return (
    <Card title="Printing and placing tags">
      <ul className="flex list-disc flex-col gap-1 pl-5">
        <li>
          Print on heat- and moisture-rated label stock (polyester or vinyl). Paper labels do not last on a boiler jacket.
        </li>
        <li>Put the tag on the jacket where it can be seen and scanned from where a technician stands.</li>
        <li>Never cover the rating plate, the warnings or the wiring diagram.</li>
        <li>Keep it off surfaces too hot to touch, such as the flue, the draft hood and near the burner opening.</li>
      </ul>
      <div className="mt-3">
        <Notice kind="caution" title="Hot surfaces">
          Stick tags on with the appliance cool or off, and follow the manufacturer&apos;s instructions on what may be attached to the jacket.
        </Notice>
      </div>
    </Card>
  );
}
