import type { ChildProcess } from 'node:child_process';

export type RestartPolicy = {
  /** Crashes allowed within `windowMs` before giving up. */
  maxRestarts: number;
  windowMs: number;
  /** Wait before the 1st, 2nd, … restart in the window (the last one repeats). */
  delaysMs: number[];
};

export const DEFAULT_RESTART_POLICY: RestartPolicy = { maxRestarts: 5, windowMs: 10 * 60_000, delaysMs: [1000, 2000, 5000, 10_000, 20_000] };

/** What to do after a crash at `now`, given every crash so far (this one included). */
export function nextRestart(crashTimes: number[], now: number, policy: RestartPolicy): { restart: true; delayMs: number; count: number } | { restart: false; count: number } {
  const count = crashTimes.filter((t) => now - t < policy.windowMs).length;
  if (count > policy.maxRestarts) return { restart: false, count };
  return { restart: true, delayMs: policy.delaysMs[Math.min(count - 1, policy.delaysMs.length - 1)], count };
}

export type SupervisorEnd = { reason: 'stopped' } | { reason: 'failed-to-start' | 'gave-up'; exitCode: number | null; signal: NodeJS.Signals | null };

/**
 * Runs a child process (the app) and starts it again when it dies on its own, with backoff and a limit.
 * The child tells it is serving by sending `{ type: 'ready' }` over IPC. A child that dies before it was ever
 * ready is not restarted (a bad configuration would only fail again); nor is one that crashes too often.
 */
export function supervise(opts: {
  spawn: () => ChildProcess;
  log: (line: string) => void;
  onReady: (first: boolean) => void;
  policy?: RestartPolicy;
  now?: () => number;
  /** How long a child may take to stop when asked before it is killed. */
  stopTimeoutMs?: number;
}) {
  const policy = opts.policy ?? DEFAULT_RESTART_POLICY;
  const now = opts.now ?? Date.now;
  const crashes: number[] = [];
  let child: ChildProcess | null = null;
  let everReady = false;
  let stopping = false;
  let timer: ReturnType<typeof setTimeout> | undefined;
  let finish!: (end: SupervisorEnd) => void;
  const ended = new Promise<SupervisorEnd>((resolve) => (finish = resolve));

  const start = () => {
    const c = opts.spawn();
    child = c;
    c.on('message', (msg: { type?: string }) => {
      if (msg?.type !== 'ready') return;
      opts.onReady(!everReady);
      everReady = true;
    });
    c.once('exit', (exitCode, signal) => {
      child = null;
      if (stopping) return finish({ reason: 'stopped' });
      const how = signal ? `on signal ${signal}` : `with exit code ${exitCode}`;
      if (!everReady) {
        opts.log(`The app stopped ${how} before it was ready; not restarting it. The lines above say why.`);
        return finish({ reason: 'failed-to-start', exitCode, signal });
      }
      crashes.push(now());
      const next = nextRestart(crashes, now(), policy);
      if (!next.restart) {
        opts.log(`The app stopped ${how}, ${next.count} times in ${policy.windowMs / 60_000} minutes; giving up. The lines above say why.`);
        return finish({ reason: 'gave-up', exitCode, signal });
      }
      opts.log(`The app stopped ${how}; starting it again in ${next.delayMs / 1000} s (restart ${next.count} of ${policy.maxRestarts}).`);
      timer = setTimeout(start, next.delayMs);
    });
  };
  start();

  return {
    ended,
    /** Asks the child to stop (SIGTERM, then SIGKILL after the timeout) and restarts nothing more. */
    async stop(): Promise<void> {
      stopping = true;
      clearTimeout(timer);
      const c = child;
      if (!c) return finish({ reason: 'stopped' });
      const kill = setTimeout(() => c.kill('SIGKILL'), opts.stopTimeoutMs ?? 15_000);
      c.kill('SIGTERM');
      await ended;
      clearTimeout(kill);
    },
  };
}
