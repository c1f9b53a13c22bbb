import { useId, useState, type ChangeEvent } from 'react';

/** For a phone whose live camera will not start or focus: take a still photo of the tag and read the QR from it. */
export function PhotoDecode({ onText }: { onText: (text: string) => void }) {
  const id = useId();
  const [state, setState] = useState<{ kind: 'idle' } | { kind: 'reading' } | { kind: 'failed'; message: string }>({ kind: 'idle' });

  async function decode(e: ChangeEvent<HTMLInputElement>) {
    const file = e.target.files?.[0];
    e.target.value = '';
    if (!file) return;
    setState({ kind: 'reading' });
    const url = URL.createObjectURL(file);
    try {
      const { BrowserQRCodeReader } = await import('@zxing/browser');
      const result = await new BrowserQRCodeReader().decodeFromImageUrl(url);
      setState({ kind: 'idle' });
      onText(result.getText());
    } catch {
      setState({ kind: 'failed', message: 'No QR code found in that photo. Take it closer and square on, with the whole tag in the picture.' });
    } finally {
      URL.revokeObjectURL(url);
    }
  }

  return (
    <div className="flex flex-col gap-1">
      <label
        htmlFor={id}
        className="inline-flex min-h-tap w-full cursor-pointer items-center justify-center rounded-plate border border-plate-line bg-plate-deep px-4 text-base font-semibold text-iron hover:bg-brass-light"
      >
        {state.kind === 'reading' ? 'Reading the photo…' : 'Decode a photo of the tag'}
      </label>
      <input id={id} type="file" accept="image/*" capture="environment" className="sr-only" onChange={decode} />
      {state.kind === 'failed' && (
        <p role="alert" className="text-sm font-semibold text-due">
          ⚠ {state.message}
        </p>
      )}
    </div>
  );
}
