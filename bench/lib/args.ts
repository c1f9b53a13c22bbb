/** `--name value` and `--flag` options; unknown options are an error so a typo does not silently run the default. */
export function parseArgs(argv: string[], known: Record<string, 'string' | 'boolean'>) {
  const out: Record<string, string | boolean> = {};
  for (let i = 0; i < argv.length; i++) {
    const arg = argv[i];
    const match = /^--([a-z-]+)(?:=(.*))?$/.exec(arg);
    if (!match || !(match[1] in known)) throw new Error(`Unknown option ${arg}. Known: ${Object.keys(known).map((k) => `--${k}`).join(', ')}`);
    const [, name, inline] = match;
    if (known[name] === 'boolean') out[name] = true;
    else {
      const value = inline ?? argv[++i];
      if (value === undefined) throw new Error(`--${name} needs a value`);
      out[name] = value;
    }
  }
  return out;
}

export function positiveInt(name: string, value: string | boolean | undefined, fallback: number) {
  if (value === undefined) return fallback;
  const n = Number(value);
  if (!Number.isInteger(n) || n < 1) throw new Error(`--${name} must be a positive whole number, got ${String(value)}`);
  return n;
}
