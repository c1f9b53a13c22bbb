import { useEffect, useState } from 'react';
import { Button } from '@/components/ui/button';

const key = (visitId: string) => `lifeplate:warm-up:${visitId}`;

/** Start when the burner lights; stopping it records the minutes of steady firing with the readings. */
export function WarmUpTimer({ visitId, onStop }: { visitId: string; onStop: (minutes: number) => void }) {
  const [startedAt, setStartedAt] = useState<number | null>(() => Number(localStorage.getItem(key(visitId))) || null);
  const [now, setNow] = useState(() => Date.now());
  useEffect(() => {
    if (startedAt === null) return;
    const tick = setInterval(() => setNow(Date.now()), 1000);
    return () => clearInterval(tick);
  }, [startedAt]);

  const elapsed = startedAt === null ? 0 : Math.max(0, now - startedAt);
  const minutes = Math.floor(elapsed / 60_000);
  const seconds = Math.floor((elapsed % 60_000) / 1000);

  return (
    <div className="flex items-center gap-3 rounded-plate border-2 border-plate-line bg-plate p-2">
      <div className="flex-1">
        <p className="text-sm">Take readings after several minutes of steady firing.</p>
        {startedAt !== null && (
          <p className="tabular text-2xl font-bold" role="timer" aria-label="Minutes of steady firing">
            {minutes} min {String(seconds).padStart(2, '0')} s
          </p>
        )}
      </div>
      {startedAt === null ? (
        <Button
          variant="secondary"
          onClick={() => {
            const t = Date.now();
            localStorage.setItem(key(visitId), String(t));
            setStartedAt(t);
            setNow(t);
          }}
        >
          ▶ Start timer
        </Button>
      ) : (
        <Button
          variant="secondary"
          onClick={() => {
            localStorage.removeItem(key(visitId));
            setStartedAt(null);
            onStop(Math.round((Date.now() - startedAt) / 6000) / 10);
          }}
        >
          ■ Stop
        </Button>
      )}
    </div>
  );
}
