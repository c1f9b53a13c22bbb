import { useEffect, useRef, useState } from 'react';
import type { IScannerControls } from '@zxing/browser';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { cameraUnavailableReason, describeCameraError } from '../lib/camera-problem';

type TorchCapabilities = MediaTrackCapabilities & { torch?: boolean };
type Status = { kind: 'starting' } | { kind: 'scanning' } | { kind: 'stopped' } | { kind: 'failed'; message: string };

/**
 * The live camera, reading QR codes. The decoder is loaded only here (a dynamic import), so other pages never carry it.
 * Each distinct text is reported once; the parent decides what to do with it.
 */
export function QrScanner({ onText }: { onText: (text: string) => void }) {
  const videoRef = useRef<HTMLVideoElement>(null);
  const onTextRef = useRef(onText);
  const lastText = useRef<string | null>(null);
  const [running, setRunning] = useState(true);
  // Bumped by "Start the camera", so a retry after a refusal starts afresh even while `running` stays true.
  const [attempt, setAttempt] = useState(0);
  const [unavailable] = useState(cameraUnavailableReason);
  const [status, setStatus] = useState<Status>(() => (unavailable ? { kind: 'failed', message: unavailable } : { kind: 'starting' }));
  const [torchTrack, setTorchTrack] = useState<MediaStreamTrack | null>(null);
  const [torchOn, setTorchOn] = useState(false);

  useEffect(() => {
    onTextRef.current = onText;
  }, [onText]);

  useEffect(() => {
    if (!running || unavailable) return;
    let cancelled = false;
    let controls: IScannerControls | null = null;
    lastText.current = null;
    (async () => {
      try {
        const { BrowserQRCodeReader } = await import('@zxing/browser');
        if (cancelled || !videoRef.current) return;
        const reader = new BrowserQRCodeReader(undefined, { delayBetweenScanAttempts: 150 });
        const started = await reader.decodeFromConstraints({ audio: false, video: { facingMode: { ideal: 'environment' } } }, videoRef.current, (result) => {
          const text = result?.getText();
          if (!text || text === lastText.current) return;
          lastText.current = text;
          onTextRef.current(text);
        });
        if (cancelled) {
          started.stop();
          return;
        }
        controls = started;
        setStatus({ kind: 'scanning' });
        const track = (videoRef.current?.srcObject as MediaStream | null)?.getVideoTracks()[0] ?? null;
        const capabilities = track?.getCapabilities?.() as TorchCapabilities | undefined;
        setTorchTrack(capabilities?.torch ? track : null);
      } catch (error) {
        if (!cancelled) setStatus({ kind: 'failed', message: describeCameraError(error) });
      }
    })();
    return () => {
      cancelled = true;
      controls?.stop();
      setTorchTrack(null);
      setTorchOn(false);
    };
  }, [running, attempt, unavailable]);

  async function toggleTorch() {
    if (!torchTrack) return;
    try {
      await torchTrack.applyConstraints({ advanced: [{ torch: !torchOn } as MediaTrackConstraintSet] });
      setTorchOn(!torchOn);
    } catch {
      setTorchTrack(null);
    }
  }

  function stop() {
    setRunning(false);
    setStatus({ kind: 'stopped' });
  }

  return (
    <div className="flex flex-col gap-2">
      <div className="relative aspect-square w-full overflow-hidden rounded-plate bg-iron">
        <video ref={videoRef} className="h-full w-full object-cover" muted playsInline aria-label="Camera view" />
        {status.kind === 'scanning' && (
          <div aria-hidden="true" className="pointer-events-none absolute inset-[18%] rounded-plate border-4 border-brass shadow-[0_0_0_999px_rgba(0,0,0,0.25)]" />
        )}
        {status.kind !== 'scanning' && (
          <p className="absolute inset-0 flex items-center justify-center p-4 text-center text-plate">
            {status.kind === 'starting' ? 'Starting the camera…' : 'Camera off'}
          </p>
        )}
      </div>
      <p role="status" className="text-sm text-iron-muted">
        {status.kind === 'scanning' ? 'Point the camera at the tag’s QR code and hold still.' : ''}
      </p>
      {status.kind === 'failed' && (
        <Notice kind="caution" title="Camera not available">
          {status.message}
        </Notice>
      )}
      {unavailable ? null : running && status.kind !== 'failed' ? (
        <div className="flex gap-2">
          <Button variant="danger" className="min-h-14 flex-1 text-xl" onClick={stop}>
            Stop
          </Button>
          {torchTrack && (
            <Button variant="secondary" className="min-h-14" aria-pressed={torchOn} onClick={toggleTorch}>
              {torchOn ? 'Light off' : 'Light on'}
            </Button>
          )}
        </div>
      ) : (
        <Button
          className="min-h-14 w-full text-xl"
          onClick={() => {
            setStatus({ kind: 'starting' });
            setRunning(true);
            setAttempt((n) => n + 1);
          }}
        >
          Start the camera
        </Button>
      )}
    </div>
  );
}
