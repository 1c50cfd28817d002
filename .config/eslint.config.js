// Lint rules, including the one-way import rules of the code layout: shared/ imports nothing from the
// client or the server and no Node or DOM API; the client and server never import each other;
// client features do not import one another (routes compose them).
import { readdirSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import tanstackQuery from '@tanstack/eslint-plugin-query';
import { createTypeScriptImportResolver } from 'eslint-import-resolver-typescript';
import importX from 'eslint-plugin-import-x';
import reactHooks from 'eslint-plugin-react-hooks';
import tseslint from 'typescript-eslint';

const root = fileURLToPath(new URL('..', import.meta.url));
const features = readdirSync(new URL('../src/features', import.meta.url), { withFileTypes: true })
  .filter((entry) => entry.isDirectory())
  .map((entry) => entry.name);

export default tseslint.config(
  { ignores: ['dist/**', 'node_modules/**', 'data/**', 'tests/e2e/screenshots/**', 'coverage/**'] },
  ...tseslint.configs.recommended,
  {
    plugins: { 'import-x': importX },
    settings: {
      'import-x/resolver-next': [
        createTypeScriptImportResolver({ project: [`${root}tsconfig.json`, `${root}src/tsconfig.json`], noWarnOnMultipleProjects: true }),
      ],
    },
    rules: {
      '@typescript-eslint/no-explicit-any': 'error',
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
      'import-x/no-restricted-paths': [
        'error',
        {
          basePath: root,
          zones: [
            { target: './shared', from: './src', message: 'shared/ must not import client code.' },
            { target: './shared', from: './server', message: 'shared/ must not import server code.' },
            { target: './src', from: './server', message: 'The client must not import server code.' },
            { target: './server', from: './src', message: 'The server must not import client code.' },
            ...features.map((feature) => ({
              target: `./src/features/${feature}`,
              from: './src/features',
              except: [`./${feature}`],
              message: 'Features do not import each other; compose them in a route.',
            })),
          ],
        },
      ],
    },
  },
  {
    files: ['shared/**/*.ts'],
    rules: {
      'no-restricted-imports': ['error', { patterns: [{ group: ['node:*'], message: 'shared/ runs in the browser too: no Node APIs.' }] }],
      'no-restricted-globals': ['error', 'window', 'document', 'process', 'Buffer'],
    },
  },
  {
    files: ['src/**/*.{ts,tsx}'],
    plugins: { '@tanstack/query': tanstackQuery, 'react-hooks': reactHooks },
    rules: {
      ...tanstackQuery.configs.recommended.rules,
      'react-hooks/rules-of-hooks': 'error',
      'react-hooks/exhaustive-deps': 'warn',
    },
  },
);
