import fs from 'node:fs';

const alive = (pid: number) => {
  try {
    process.kill(pid, 0);
    return true;
  } catch {
    return false;
  }
};

/** One `npm start` per data folder: a second one is told, instead of touching the running cluster. */
export function acquireLock(file: string): { ok: true; release: () => void } | { ok: false; pid: number; url: string } {
  if (fs.existsSync(file)) {
    const [pidText, url = ''] = fs.readFileSync(file, 'utf8').split('\n');
    const pid = Number(pidText);
    if (pid && pid !== process.pid && alive(pid)) return { ok: false, pid, url };
  }
  return {
    ok: true,
    release: () => {
      try {
        if (fs.readFileSync(file, 'utf8').startsWith(`${process.pid}\n`)) fs.unlinkSync(file);
      } catch {
        // already gone
      }
    },
  };
}

export function writeLock(file: string, url: string) {
  fs.writeFileSync(file, `${process.pid}\n${url}\n`);
}
