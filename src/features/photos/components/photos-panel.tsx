import { useState } from 'react';
import { Notice } from '@/components/ui/notice';
import { Spinner } from '@/components/ui/page';
import { useMe } from '@/lib/auth';
import { can } from '@shared/policy';
import { usePhotos } from '../api/list-photos';
import { defaultKind } from '../lib/upload-batch';
import { KindFilter, PhotoGrid, type PhotoFilter } from './photo-grid';
import { PhotoUpload } from './photo-upload';
import { PhotoViewer } from './photo-viewer';

/** Upload, filter chips, thumbnails and the viewer, for a whole appliance or (with visitId) one visit on it. */
export function PhotosPanel({ title, applianceId, visitId, folded = false }: { title: string; applianceId: string; visitId?: string; folded?: boolean }) {
  const me = useMe();
  const photos = usePhotos(applianceId);
  const [filter, setFilter] = useState<PhotoFilter>('all');
  const [openId, setOpenId] = useState<string | null>(null);
  const principal = me.data?.principal;
  const scoped = (photos.data ?? []).filter((p) => !visitId || p.visitId === visitId);
  const shown = filter === 'all' ? scoped : scoped.filter((p) => p.kind === filter);
  const open = scoped.find((p) => p.id === openId);

  const body = (
    <>
      {can(principal, 'visits:record') && <PhotoUpload applianceId={applianceId} visitId={visitId} suggestedKind={defaultKind(photos.data)} />}
      {photos.isPending ? (
        <Spinner label="Loading photos…" />
      ) : photos.isError ? (
        <Notice kind="danger" title="Photos not loaded">
          {photos.error.message}
        </Notice>
      ) : scoped.length === 0 ? (
        <p className="text-iron-muted">No photos yet.</p>
      ) : (
        <>
          <KindFilter photos={scoped} value={filter} onChange={setFilter} />
          {shown.length ? <PhotoGrid photos={shown} onOpen={setOpenId} /> : <p className="text-iron-muted">No photos of this kind.</p>}
        </>
      )}
      {open && (
        <PhotoViewer
          key={open.id}
          photo={open}
          canEdit={can(principal, 'records:write')}
          timeZone={me.data?.company?.timeZone ?? 'UTC'}
          onClose={() => setOpenId(null)}
        />
      )}
    </>
  );
  const box = 'flex flex-col gap-3 rounded-plate border-2 border-plate-line bg-plate-deep p-3 text-iron';
  if (folded) {
    // On the life record, below the first screen: the count says whether opening it is worth it.
    const count = photos.data ? (scoped.length ? `${scoped.length} ${scoped.length === 1 ? 'photo' : 'photos'}` : 'none yet') : undefined;
    return (
      <section aria-label={title} className={box}>
        <details>
          <summary className="flex min-h-tap cursor-pointer flex-wrap content-center items-baseline gap-x-2">
            <h2 className="text-lg font-bold">{title}</h2>
            {count && <span className="text-sm text-iron-muted">{count}</span>}
          </summary>
          <div className="mt-2 flex flex-col gap-3">{body}</div>
        </details>
      </section>
    );
  }
  return (
    <section aria-label={title} className={box}>
      <h2 className="text-lg font-bold">{title}</h2>
      {body}
    </section>
  );
}
