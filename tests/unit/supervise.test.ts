import { fork } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { nextRestart, supervise, type RestartPolicy } from '../../scripts/lib/supervise';

const MINUTE = 60_000;
const policy: RestartPolicy = { maxRestarts: 3, windowMs: 10 * MINUTE, delaysMs: [1000, 5000] };

describe('nextRestart', () => {
  it('waits longer after each crash in the window, and gives up past the limit', () => {
    expect(nextRestart([0], 0, policy)).toEqual({ restart: true, delayMs: 1000, count: 1 });
    expect(nextRestart([0, MINUTE], MINUTE, policy)).toEqual({ restart: true, delayMs: 5000, count: 2 });
    expect(nextRestart([0, MINUTE, 2 * MINUTE], 2 * MINUTE, policy)).toEqual({ restart: true, delayMs: 5000, count: 3 });
    expect(nextRestart([0, MINUTE, 2 * MINUTE, 3 * MINUTE], 3 * MINUTE, policy)).toEqual({ restart: false, count: 4 });
  });

  it('forgets crashes older than the window', () => {
    expect(nextRestart([0, MINUTE, 2 * MINUTE, 15 * MINUTE], 15 * MINUTE, policy)).toEqual({ restart: true, delayMs: 1000, count: 1 });
  });
});

describe('supervise', () => {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'lifeplate-supervise-'));
  afterAll(() => fs.rmSync(dir, { recursive: true, force: true }));
  const fast: RestartPolicy = { maxRestarts: 2, windowMs: 10 * MINUTE, delaysMs: [10] };

  /** A child that says it is ready, then crashes on its first `crashes` runs and stays up after that. */
  function childScript(name: string, crashes: number, ready = true) {
    const file = path.join(dir, `${name}.cjs`);
    const counter = path.join(dir, `${name}.runs`);
    fs.writeFileSync(
      file,
      `const fs = require('fs');
const runs = (fs.existsSync(${JSON.stringify(counter)}) ? Number(fs.readFileSync(${JSON.stringify(counter)}, 'utf8')) : 0) + 1;
fs.writeFileSync(${JSON.stringify(counter)}, String(runs));
${ready ? "process.send({ type: 'ready' });" : ''}
if (runs <= ${crashes}) setImmediate(() => { throw new Error('simulated crash'); });
else setInterval(() => {}, 1000);
process.on('SIGTERM', () => process.exit(0));`,
    );
    return () => fork(file, [], { execArgv: [], stdio: ['ignore', 'ignore', 'ignore', 'ipc'] });
  }

  it('starts a crashed app again and says so, then stops it when asked', async () => {
    const lines: string[] = [];
    const readies: boolean[] = [];
    let spawned = 0;
    const spawn = childScript('once', 1);
    let backAgain!: () => void;
    const back = new Promise<void>((r) => (backAgain = r));
    const s = supervise({
      spawn: () => (spawned++, spawn()),
      log: (l) => lines.push(l),
      onReady: (first) => {
        readies.push(first);
        if (!first) backAgain();
      },
      policy: fast,
    });
    await back;
    expect(readies).toEqual([true, false]);
    expect(spawned).toBe(2);
    expect(lines).toEqual([expect.stringMatching(/^The app stopped with exit code 1; starting it again in 0.01 s \(restart 1 of 2\)\.$/)]);
    await s.stop();
    expect(await s.ended).toEqual({ reason: 'stopped' });
  });

  it('gives up after too many crashes and says why', async () => {
    const lines: string[] = [];
    let spawned = 0;
    const spawn = childScript('always', 100);
    const s = supervise({ spawn: () => (spawned++, spawn()), log: (l) => lines.push(l), onReady: () => {}, policy: fast });
    expect(await s.ended).toEqual({ reason: 'gave-up', exitCode: 1, signal: null });
    expect(spawned).toBe(3);
    expect(lines.at(-1)).toMatch(/giving up/);
  });

  it('does not restart an app that never got ready (its configuration would only fail again)', async () => {
    const lines: string[] = [];
    let spawned = 0;
    const spawn = childScript('never', 100, false);
    const s = supervise({ spawn: () => (spawned++, spawn()), log: (l) => lines.push(l), onReady: () => {}, policy: fast });
    expect(await s.ended).toEqual({ reason: 'failed-to-start', exitCode: 1, signal: null });
    expect(spawned).toBe(1);
    expect(lines).toEqual([expect.stringMatching(/before it was ready; not restarting it/)]);
  });
});
