import fs from 'node:fs';
import path from 'node:path';
import { builtinModules } from 'node:module';
import ts from 'typescript';
import { describe, expect, it } from 'vitest';

const ROOT = path.resolve(import.meta.dirname, '../..');
const pkg = JSON.parse(fs.readFileSync(path.join(ROOT, 'package.json'), 'utf8')) as { dependencies: Record<string, string> };

/** What the server loads in production: the app with its jobs, and the migrations run before it listens. */
const ENTRIES = ['server/main.ts', 'server/db/migrate.ts'];

/** Module names a file loads at run time: type-only imports are erased by the compiler and load nothing. */
function runtimeSpecifiers(file: string): string[] {
  const source = ts.createSourceFile(file, fs.readFileSync(file, 'utf8'), ts.ScriptTarget.Latest, true);
  const found: string[] = [];
  const visit = (node: ts.Node) => {
    if (ts.isImportDeclaration(node) && ts.isStringLiteral(node.moduleSpecifier)) {
      const clause = node.importClause;
      const named = clause?.namedBindings;
      const onlyTypes =
        clause?.isTypeOnly ||
        (clause && !clause.name && named && ts.isNamedImports(named) && named.elements.length > 0 && named.elements.every((e) => e.isTypeOnly));
      if (!onlyTypes) found.push(node.moduleSpecifier.text);
    } else if (ts.isExportDeclaration(node) && node.moduleSpecifier && ts.isStringLiteral(node.moduleSpecifier) && !node.isTypeOnly) {
      found.push(node.moduleSpecifier.text);
    } else if (ts.isCallExpression(node) && node.expression.kind === ts.SyntaxKind.ImportKeyword && node.arguments[0] && ts.isStringLiteral(node.arguments[0])) {
      found.push(node.arguments[0].text);
    }
    ts.forEachChild(node, visit);
  };
  visit(source);
  return found;
}

/** The path aliases of tsconfig.json: the share page's first screen is rendered on the server from src/. */
const ALIASES: Record<string, string> = { '@/': 'src', '@shared/': 'shared' };
const aliasOf = (specifier: string) => Object.keys(ALIASES).find((a) => specifier.startsWith(a));
const isLocal = (specifier: string) => specifier.startsWith('.') || aliasOf(specifier) !== undefined;

function resolveLocal(from: string, specifier: string): string {
  const alias = aliasOf(specifier);
  const base = alias
    ? path.join(ROOT, ALIASES[alias], specifier.slice(alias.length))
    : path.resolve(path.dirname(from), specifier.replace(/\.js$/, ''));
  const candidate = [base, `${base}.ts`, `${base}.tsx`, path.join(base, 'index.ts')].find((p) => fs.existsSync(p) && fs.statSync(p).isFile());
  if (!candidate) throw new Error(`${path.relative(ROOT, from)} imports ${specifier}, which does not resolve`);
  return candidate;
}

const packageName = (specifier: string) => specifier.split('/').slice(0, specifier.startsWith('@') ? 2 : 1).join('/');
const isBuiltin = (specifier: string) => specifier.startsWith('node:') || builtinModules.includes(packageName(specifier));

/** Follows the server's own imports from the entries; returns each package it loads with the first file that does. */
function packagesLoadedBy(entries: string[]) {
  const seen = new Set<string>();
  const packages = new Map<string, string>();
  const queue = entries.map((e) => path.join(ROOT, e));
  while (queue.length) {
    const file = queue.pop()!;
    if (seen.has(file)) continue;
    seen.add(file);
    for (const specifier of runtimeSpecifiers(file)) {
      if (isLocal(specifier)) queue.push(resolveLocal(file, specifier));
      else if (!isBuiltin(specifier) && !packages.has(packageName(specifier))) packages.set(packageName(specifier), path.relative(ROOT, file));
    }
  }
  return { files: [...seen].map((f) => path.relative(ROOT, f)), packages };
}

describe('run-time dependencies', () => {
  const { files, packages } = packagesLoadedBy(ENTRIES);

  it('follows the server through its modules', () => {
    expect(files).toEqual(expect.arrayContaining(['server/app.ts', 'server/modules/due/due-csv.ts', 'server/logger.ts', 'shared/policy.ts']));
    expect([...packages.keys()]).toEqual(expect.arrayContaining(['express', 'papaparse', 'pino']));
  });

  it('finds every package the server loads in dependencies, so a production install (npm ci --omit=dev) has it', () => {
    const missing = [...packages].filter(([name]) => !(name in pkg.dependencies)).map(([name, file]) => `${name} (imported by ${file})`);
    expect(missing).toEqual([]);
  });
});
