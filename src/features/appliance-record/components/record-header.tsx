import { LABELS } from '@shared/schemas/enums';
import type { ApplianceRecordDto } from '@shared/schemas/records';
import { btuh, formatDate, makeModel } from '../lib/labels';
import { Fact, Section } from './section';
import { RECORD_SECTIONS } from '@shared/glossary';

export function RecordHeader({ record }: { record: ApplianceRecordDto }) {
  const { appliance: a, site, lastVisit } = record;
  const rating = btuh(a.inputBtuh) ?? (a.firingRateGph != null ? `${a.firingRateGph} gph` : 'Not recorded');
  return (
    <Section title={RECORD_SECTIONS.whatItIs}>
      <dl className="grid grid-cols-2 gap-x-3 gap-y-2">
        <Fact label="Construction">{LABELS.construction[a.construction]}</Fact>
        <Fact label="Age">{record.ageYears == null ? 'Unknown' : `${record.ageYears} ${record.ageYears === 1 ? 'year' : 'years'}`}</Fact>
        <Fact wide label="Make and model">{makeModel(a)}</Fact>
        <Fact label="Serial">
          <span className="tabular break-all">{a.serial ?? 'Not recorded'}</span>
        </Fact>
        <Fact label="Input rating">{rating}</Fact>
        <Fact label="Location">{a.location ?? 'Not recorded'}</Fact>
        <Fact label="Last visit">
          {lastVisit ? `${formatDate(lastVisit.visitedOn)} · ${LABELS.visitType[lastVisit.type]}` : 'No visit recorded'}
        </Fact>
        <Fact wide label="Site">
          {site.street}, {site.town}
          {site.postalCode ? ` ${site.postalCode}` : ''}
        </Fact>
        {site.accessNotes && (
          <Fact wide label="Access">
            {site.accessNotes}
          </Fact>
        )}
      </dl>
      <p className="mt-3 flex flex-wrap gap-4 text-sm">
        <a className="min-h-tap inline-flex items-center font-semibold underline" href={`/api/appliances/${a.id}/life-record.pdf`} download>
          Export the life record (PDF)
        </a>
        <a className="min-h-tap inline-flex items-center font-semibold underline" href={`/api/appliances/${a.id}/life-record.json`} download>
          Export as JSON
        </a>
      </p>
    </Section>
  );
}
