import { Icon } from '@/components/ui/icons';
import { PHOTO_KIND_LABELS, type PhotoDto, type PhotoKind } from '@shared/schemas/photos';
import { photoAlt } from '../lib/upload-batch';

export const FILTER_KINDS = ['nameplate', 'before', 'after', 'finding'] as const satisfies PhotoKind[];
export type PhotoFilter = (typeof FILTER_KINDS)[number] | 'all';

export function KindFilter({ photos, value, onChange }: { photos: PhotoDto[]; value: PhotoFilter; onChange: (f: PhotoFilter) => void }) {
  const chips: { key: PhotoFilter; label: string; count: number }[] = [
    { key: 'all', label: 'All', count: photos.length },
    ...FILTER_KINDS.map((k) => ({ key: k, label: PHOTO_KIND_LABELS[k], count: photos.filter((p) => p.kind === k).length })),
  ];
  return (
    <div role="group" aria-label="Show photos of kind" className="flex flex-wrap items-center gap-2">
      <span aria-hidden="true" className="text-sm font-semibold text-iron-muted">
        Show
      </span>
      {chips.map((c) => (
        <button
          key={c.key}
          type="button"
          aria-pressed={value === c.key}
          onClick={() => onChange(c.key)}
          className="min-h-tap rounded-plate border-2 border-plate-line bg-transparent px-3 text-sm font-semibold aria-pressed:border-brass-dark aria-pressed:bg-brass-light"
        >
          {c.label} <span className="tabular">({c.count})</span>
        </button>
      ))}
    </div>
  );
}

export function PhotoGrid({ photos, onOpen }: { photos: PhotoDto[]; onOpen: (id: string) => void }) {
  return (
    <ul aria-label="Photos" className="grid grid-cols-3 gap-2 sm:grid-cols-4 md:grid-cols-6">
      {photos.map((p) => (
        <li key={p.id} className="relative flex flex-col gap-0.5">
          <button
            type="button"
            onClick={() => onOpen(p.id)}
            aria-label={`Open photo: ${photoAlt(p)}`}
            className="block aspect-square w-full overflow-hidden rounded-plate border border-plate-line bg-surface focus-visible:outline-3 focus-visible:outline-brass"
          >
            <img src={p.thumbUrl} alt={photoAlt(p)} loading="lazy" decoding="async" className="h-full w-full object-cover" />
          </button>
          {p.homeownerVisible && (
            <span className="pointer-events-none absolute top-1 left-1 inline-flex items-center gap-0.5 rounded-full bg-surface px-1.5 text-xs font-semibold text-ok">
              <Icon name="check" className="h-3 w-3" />
              Homeowner<span className="sr-only"> can see this photo</span>
            </span>
          )}
          <span className="truncate text-xs font-semibold">{PHOTO_KIND_LABELS[p.kind]}</span>
        </li>
      ))}
    </ul>
  );
}
