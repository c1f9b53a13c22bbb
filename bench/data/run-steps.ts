import type pg from 'pg';
import type { LoadStep } from './load-records';

/**
 * Runs a step's statements one by one (the extended protocol takes one statement per query), giving each only
 * the parameters it uses, renumbered from $1.
 */
export async function runStep(client: pg.ClientBase, step: LoadStep) {
  const statements = step.sql.split(/;\s*\n/).map((s) => s.trim()).filter(Boolean);
  for (const statement of statements) {
    const used = [...new Set([...statement.matchAll(/\$(\d+)/g)].map((m) => Number(m[1])))].sort((a, b) => a - b);
    const text = statement.replace(/\$(\d+)/g, (_m, n: string) => `$${used.indexOf(Number(n)) + 1}`);
    await client.query(text, used.map((n) => step.params?.[n - 1]));
  }
}
