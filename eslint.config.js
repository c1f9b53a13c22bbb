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
    // Features never import each other (bulletproof-react); shared code lives in components/, lib/ and shared/.
    files: ['src/features/**/*.{ts,tsx}'],
    rules: {
      'no-restricted-imports': ['error', { patterns: [{ group: ['@/features/*'], message: 'Features must not import other features.' }] }],
    },
  },
);
