import js from '@eslint/js';
import tseslint from 'typescript-eslint';
import reactHooks from 'eslint-plugin-react-hooks';

export default tseslint.config(
  { ignores: ['dist/**', 'node_modules/**', '.data/**', 'drizzle/**', 'bench/results/**', '*.tmp.ts'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    files: ['src/**/*.{ts,tsx}'],
    plugins: { 'react-hooks': reactHooks },
    rules: { ...reactHooks.configs.recommended.rules },
  },
  {
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
      '@typescript-eslint/no-explicit-any': 'error',
    },
  },
  {
    // Every string a request carries goes through storableText() (shared/schemas/common.ts), which refuses text
    // PostgreSQL cannot store; a bare z.string() would reopen that hole.
    files: ['shared/**/*.ts', 'server/**/*.ts'],
    ignores: ['shared/schemas/common.ts', 'server/config.ts'],
    rules: {
      'no-restricted-syntax': [
        'error',
        { selector: "MemberExpression[object.name='z'][property.name='string']", message: 'Use storableText() from shared/schemas/common.ts.' },
      ],
    },
  },
  {
    // Module boundaries (DEVELOPERS.md): a module's repository is private to it, and another module is reached only
    // through its index.ts. Shared code lives in server/core, server/lib, server/db and shared/.
    files: ['server/modules/**/*.ts'],
    ignores: ['server/modules/*/*.routes.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            { regex: '^\\.\\./(?!\\.\\.)[^/]+/.+', message: "Import another module through its index ('../<module>'), never its files." },
            { regex: '/modules/[^/]+/[^/]+\\.repository$', message: "A module's repository is private to it; use what the module's index.ts exports." },
          ],
        },
      ],
    },
  },
  {
    // Routes are thin: they call services, never a repository (their own module's included).
    files: ['server/modules/*/*.routes.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            { regex: '^\\.\\./(?!\\.\\.)[^/]+/.+', message: "Import another module through its index ('../<module>'), never its files." },
            { regex: '\\.repository$', message: 'Routes call services, not repositories.' },
          ],
        },
      ],
    },
  },
  {
    // Outside the modules (app, auth, jobs, db seed and factories, spa, core): never a module's repository.
    files: ['server/**/*.ts'],
    ignores: ['server/modules/**'],
    rules: {
      'no-restricted-imports': [
        'error',
        { patterns: [{ regex: '/modules/[^/]+/[^/]+\\.repository$', message: "A module's repository is private to it; use what the module's index.ts exports." }] },
      ],
    },
  },
  {
    // Features never import each other (bulletproof-react); shared code lives in components/, lib/ and shared/.
    files: ['src/features/**/*.{ts,tsx}'],
    rules: {
      'no-restricted-imports': ['error', { patterns: [{ group: ['@/features/*'], message: 'Features must not import other features.' }] }],
    },
  },
);
