import { formatInstant } from '@shared/format/dates';
import { useEffect, useId, useRef } from 'react';
import { Button } from '@/components/ui/button';
import { PHOTO_KIND_LABELS, type PhotoDto } from '@shared/schemas/photos';
import { useUpdatePhoto } from '../api/update-photo';
import { photoAlt } from '../lib/upload-batch';

const addedAt = (iso: string, timeZone: string) => formatInstant(iso, timeZone);

function VisibilitySwitch({ photo }: { photo: PhotoDto }) {
  const update = useUpdatePhoto(photo.applianceId);
  // Shows the asked-for state while the change is on its way, the stored one otherwise.
  const visible = update.isPending ? Boolean(update.variables.change.homeownerVisible) : photo.homeownerVisible;
  return (
    <div className="flex flex-col gap-1">
      <label className="flex min-h-tap cursor-pointer items-center gap-3 font-semibold">
        <input
          type="checkbox"
          role="switch"
          checked={visible}
          disabled={update.isPending}
          onChange={(e) => update.mutate({ id: photo.id, change: { homeownerVisible: e.target.checked } })}
          className="h-6 w-6 accent-iron"
        />
        Visible to the homeowner
      </label>
      <p className="text-sm text-iron-muted" role="status">
        {update.isPending ? 'Saving…' : visible ? 'The homeowner sees this photo on their record.' : 'Only your company sees this photo.'}
      </p>
      {update.isError && (
        <p role="alert" className="text-sm font-semibold text-due">
          ⚠ Not changed: {update.error.message}
        </p>
      )}
    </div>
  );
}

/** The full display image with what is known about it; a native modal dialog, so Back/Escape and focus behave. */
export function PhotoViewer({ photo, canEdit, timeZone, onClose }: { photo: PhotoDto; canEdit: boolean; timeZone: string; onClose: () => void }) {
  const ref = useRef<HTMLDialogElement>(null);
  const titleId = useId();
  useEffect(() => {
    // No close() on cleanup: it would fire onClose later and shut a viewer that StrictMode has just remounted.
    if (ref.current && !ref.current.open) ref.current.showModal();
  }, []);
  return (
    <dialog
      ref={ref}
      onClose={onClose}
      aria-labelledby={titleId}
      className="m-0 h-full max-h-none w-full max-w-none bg-plate p-0 text-iron backdrop:bg-black/80 sm:m-auto sm:h-auto sm:max-h-[95vh] sm:max-w-3xl sm:rounded-plate"
    >
      <div className="flex min-h-full flex-col">
        <img src={photo.displayUrl} alt={photoAlt(photo)} width={photo.width} height={photo.height} className="max-h-[65vh] w-full bg-black object-contain" />
        <div className="flex flex-1 flex-col gap-3 p-3">
          <h2 id={titleId} className="text-lg font-bold">
            {PHOTO_KIND_LABELS[photo.kind]} photo
          </h2>
          <p className={photo.caption ? '' : 'text-iron-muted'}>{photo.caption ?? 'No caption.'}</p>
          <p className="text-sm text-iron-muted">
            Added {addedAt(photo.createdAt, timeZone)}
            {photo.createdByName ? ` by ${photo.createdByName}` : ''}
          </p>
          {canEdit ? (
            <VisibilitySwitch photo={photo} />
          ) : (
            <p className="text-sm">{photo.homeownerVisible ? 'The homeowner sees this photo.' : 'Only your company sees this photo.'}</p>
          )}
          <Button variant="secondary" className="mt-auto w-full" onClick={() => ref.current?.close()}>
            Close
          </Button>
        </div>
      </div>
    </dialog>
  );
}
