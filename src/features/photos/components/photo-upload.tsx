import { useId, useState, type ChangeEvent, type InputHTMLAttributes, type ReactNode } from 'react';
import { TextField } from '@/components/ui/field';
import { PHOTO_KIND_LABELS, PHOTO_KINDS, type PhotoKind } from '@shared/schemas/photos';
import { usePhotoUpload } from '../lib/use-photo-upload';
import { UploadStatus } from './upload-status';

const bigButton =
  'flex min-h-14 flex-1 cursor-pointer items-center justify-center rounded-plate px-3 text-center text-lg font-bold has-[:disabled]:cursor-not-allowed has-[:disabled]:opacity-50 has-[:focus-visible]:outline-3 has-[:focus-visible]:outline-offset-2 has-[:focus-visible]:outline-brass';

/** A file input dressed as a big button: the label is the tap target and the input's accessible name. */
function FileButton({ children, className, ...input }: { children: ReactNode; className: string } & InputHTMLAttributes<HTMLInputElement>) {
  return (
    <label className={`${bigButton} ${className}`}>
      <input type="file" accept="image/*" className="sr-only" {...input} />
      {children}
    </label>
  );
}

export function PhotoUpload({ applianceId, visitId, suggestedKind }: { applianceId: string; visitId?: string; suggestedKind: PhotoKind }) {
  const [chosenKind, setChosenKind] = useState<PhotoKind | null>(null);
  const kind = chosenKind ?? suggestedKind;
  const [caption, setCaption] = useState('');
  const { state, start, retry, stop } = usePhotoUpload(applianceId, visitId);
  const sending = state.phase === 'sending';
  const groupName = `photo-kind-${useId().replace(/:/g, '')}`;

  async function onFiles(e: ChangeEvent<HTMLInputElement>) {
    const files = Array.from(e.target.files ?? []);
    // Cleared so that choosing the same file again (say, after a failure) still fires a change.
    e.target.value = '';
    if (!files.length) return;
    if (await start(files, kind, caption)) setCaption('');
  }

  return (
    <div className="flex flex-col gap-3 rounded-plate border border-plate-line bg-plate p-3" aria-labelledby={`${groupName}-title`} role="group">
      <h3 id={`${groupName}-title`} className="font-bold">
        Add photos
      </h3>
      <fieldset className="flex flex-col gap-1">
        <legend className="mb-1 text-sm font-semibold">What the photos show</legend>
        <div className="flex flex-wrap gap-2">
          {PHOTO_KINDS.map((k) => (
            <label
              key={k}
              className="flex min-h-tap cursor-pointer items-center rounded-full border-2 border-plate-line bg-surface px-4 font-semibold has-[:checked]:border-iron has-[:checked]:bg-iron has-[:checked]:text-plate has-[:focus-visible]:outline-3 has-[:focus-visible]:outline-brass"
            >
              <input type="radio" name={groupName} value={k} checked={kind === k} onChange={() => setChosenKind(k)} className="sr-only" />
              {PHOTO_KIND_LABELS[k]}
            </label>
          ))}
        </div>
        {state.fieldErrors.kind?.map((m) => (
          <p key={m} role="alert" className="text-sm font-semibold text-due">
            ⚠ {m}
          </p>
        ))}
      </fieldset>
      <TextField label="Caption (optional)" value={caption} maxLength={500} onChange={(e) => setCaption(e.target.value)} error={state.fieldErrors.caption} />
      <div className="flex gap-2">
        <FileButton className="bg-iron text-plate" capture="environment" disabled={sending} onChange={onFiles}>
          Take photo
        </FileButton>
        <FileButton className="border-2 border-iron bg-surface text-iron" multiple disabled={sending} onChange={onFiles}>
          Choose files
        </FileButton>
      </div>
      <p className="text-sm text-iron-muted">Location data is removed from photos before they are stored.</p>
      <UploadStatus
        state={state}
        onStop={stop}
        onRetry={async () => {
          if (await retry()) setCaption('');
        }}
      />
    </div>
  );
}
