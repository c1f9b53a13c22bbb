import { useState } from 'react';
import { Notice } from '@/components/ui/notice';
import type { CheckMark } from '@shared/schemas/enums';
import type { ChecklistItemDto } from '@shared/schemas/visits';
import { ChoiceButtons, TextArea } from './inputs';
import { useDraft } from './draft-context';
import type { ReadingKey } from '@shared/schemas/visits';
import { ReadingBlock } from './readings/reading-block';
import { RequiredReading } from './readings/required-reading';
import { isScalarReading } from './readings/simple-readings';

const MARKS: { value: CheckMark; label: string; icon: string; tone: 'ok' | 'due' | 'plain' }[] = [
  { value: 'done', label: 'Done', icon: '✓', tone: 'ok' },
  { value: 'not_applicable', label: 'N/A', icon: '–', tone: 'plain' },
  { value: 'needs_attention', label: 'Needs attention', icon: '!', tone: 'due' },
];

export function Checklist({ items }: { items: ChecklistItemDto[] }) {
  const { fields } = useDraft();
  const sections = [...new Set(items.map((i) => i.section))];
  const marked = fields.checklist.filter((c) => c.mark).length;
  // A readings block shows once, at the first item that names it; later items point back to it.
  const firstItemFor = new Map<string, ChecklistItemDto>();
  for (const item of items) for (const key of item.readings ?? []) if (!firstItemFor.has(key)) firstItemFor.set(key, item);
  return (
    <div className="flex flex-col gap-4">
      <p className="font-semibold" aria-live="polite">
        {marked} of {items.length} marked
      </p>
      {sections.map((section) => (
        <section key={section} aria-label={section} className="flex flex-col gap-2">
          <h2 className="pt-1 text-lg font-bold">{section}</h2>
          <ul className="flex flex-col gap-2">
            {items
              .filter((i) => i.section === section)
              .map((item) => (
                <ChecklistItem key={item.key} item={item} firstItemFor={firstItemFor} />
              ))}
          </ul>
        </section>
      ))}
    </div>
  );
}

function ChecklistItem({ item, firstItemFor }: { item: ChecklistItemDto; firstItemFor: Map<string, ChecklistItemDto> }) {
  const { fields, edit, completionTried } = useDraft();
  const entry = fields.checklist.find((c) => c.key === item.key);
  const unmarked = completionTried && !entry?.mark;
  const [noteOpen, setNoteOpen] = useState(false);
  const showNote = noteOpen || Boolean(entry?.note) || entry?.mark === 'needs_attention';
  const update = (patch: Partial<{ mark: CheckMark | null; note: string }>) =>
    edit((f) => ({
      ...f,
      checklist: f.checklist.some((c) => c.key === item.key)
        ? f.checklist.map((c) => (c.key === item.key ? { ...c, ...patch } : c))
        : [...f.checklist, { key: item.key, mark: null, note: '', ...patch }],
    }));

  return (
    <li
      id={`item-${item.key}`}
      className={`flex scroll-mt-32 flex-col gap-2 rounded-plate border-2 bg-plate-deep p-3 ${unmarked ? 'border-due' : 'border-plate-line'}`}
      data-item={item.key}
      data-field={`checklist.${item.key}`}
    >
      <p className="font-semibold">{item.label}</p>
      {item.caution && (
        <Notice kind="caution" title="Caution">
          {item.caution}
        </Notice>
      )}
      <ChoiceButtons label={item.label} choices={MARKS} value={entry?.mark ?? null} onChange={(mark) => update({ mark })} clearable />
      {unmarked && <p className="text-sm font-semibold text-due">⚠ Not marked yet: done, N/A or needs attention.</p>}
      <ItemReadings item={item} firstItemFor={firstItemFor} />
      {showNote ? (
        <TextArea label="Note" rows={2} maxLength={2000} value={entry?.note ?? ''} onChange={(note) => update({ note })} />
      ) : (
        <button type="button" className="min-h-tap self-start px-1 font-semibold underline" onClick={() => setNoteOpen(true)}>
          + Add a note
        </button>
      )}
    </li>
  );
}

/** One reading's inputs, marked for jumping to, with the required-reading note when the template requires it. */
function OwnReading({ readingKey }: { readingKey: string }) {
  const { requiredReadings } = useDraft();
  return (
    <div className="flex flex-col gap-2" data-field={`readings.${readingKey}`}>
      <ReadingBlock readingKey={readingKey} />
      {requiredReadings.includes(readingKey) && <RequiredReading readingKey={readingKey as ReadingKey} />}
    </div>
  );
}

function ItemReadings({ item, firstItemFor }: { item: ChecklistItemDto; firstItemFor: Map<string, ChecklistItemDto> }) {
  const keys = item.readings ?? [];
  const own = keys.filter((k) => firstItemFor.get(k)?.key === item.key);
  const elsewhere = [...new Set(keys.filter((k) => firstItemFor.get(k)?.key !== item.key).map((k) => firstItemFor.get(k)!))];
  const scalars = own.filter(isScalarReading);
  return (
    <>
      {scalars.length > 0 && (
        <div className="grid grid-cols-2 gap-2">
          {scalars.map((key) => (
            <OwnReading key={key} readingKey={key} />
          ))}
        </div>
      )}
      {own
        .filter((k) => !isScalarReading(k))
        .map((key) => (
          <OwnReading key={key} readingKey={key} />
        ))}
      {elsewhere.map((first) => (
        <a key={first.key} href={`#item-${first.key}`} className="flex min-h-tap items-center text-sm font-semibold underline">
          ↑ Readings for this go with “{first.label.split(/[.;:]/)[0]}”
        </a>
      ))}
    </>
  );
}
