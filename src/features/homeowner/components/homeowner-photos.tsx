import { useEffect, useState } from 'react';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { useIsClient } from '@/lib/use-is-client';
import type { HomeownerViewDto } from '@shared/schemas/homeowner';
import { photoPath, type RecordSource } from '../api/record-source';
import { LABELS } from '@shared/glossary';
import { formatCalendarDate } from '@shared/format/dates';

type Photo = HomeownerViewDto['photos'][number];
const KIND_WORDS: Record<string, string> = LABELS.photoKindForHousehold;
const describe = (p: Photo) => p.caption ?? `${KIND_WORDS[p.kind] ?? 'Photo'}, ${formatCalendarDate(p.takenOn, { long: true })}`;

/** The photos the company marked for the homeowner: small thumbnails that load as they scroll in, a tap opens the large one. */
export function HomeownerPhotos({ source, photos }: { source: RecordSource; photos: Photo[] }) {
  const [open, setOpen] = useState<Photo | null>(null);
  const ready = useIsClient();
  useEffect(() => {
    if (!open) return;
    const close = (e: KeyboardEvent) => e.key === 'Escape' && setOpen(null);
    window.addEventListener('keydown', close);
    return () => window.removeEventListener('keydown', close);
  }, [open]);
  if (!photos.length) return null;

  return (
    <Card title="Photos">
      <ul className="grid grid-cols-3 gap-2">
        {photos.map((p) => (
          <li key={p.id}>
            <button type="button" disabled={!ready} onClick={() => setOpen(p)} className="block w-full rounded-plate" aria-label={`Open the photo: ${describe(p)}`}>
              <img
                src={photoPath(source, p.id, 'thumb')}
                alt={describe(p)}
                width={160}
                height={160}
                loading="lazy"
                decoding="async"
                className="aspect-square w-full rounded-plate bg-plate-deep object-cover"
              />
            </button>
          </li>
        ))}
      </ul>
      {open && (
        <div role="dialog" aria-modal="true" aria-label={describe(open)} className="fixed inset-0 z-20 flex flex-col bg-black/90 p-2">
          <div className="flex justify-end">
            <Button variant="secondary" onClick={() => setOpen(null)} autoFocus>
              Close
            </Button>
          </div>
          <img src={photoPath(source, open.id, 'display')} alt={describe(open)} className="m-auto max-h-[85vh] max-w-full object-contain" />
          <p className="p-2 text-center text-white">{describe(open)}</p>
        </div>
      )}
    </Card>
  );
}
