import js from '@eslint/js';
import tseslint from 'typescript-eslint';
import reactHooks from 'eslint-plugin-react-hooks';
import globals from 'globals';

// The pure core must stay pure: no UI, HTTP, database, 3D, PDF or Node built-ins.
const forbiddenInDomain = [
  { group: ['react', 'react-*', 'react/*', '@react-three/*', '@tanstack/*'], message: 'src/domain is pure: no React.' },
  { group: ['express', 'express-*', 'passport*', 'helmet'], message: 'src/domain is pure: no Express.' },
  { group: ['knex', 'pg', 'pg-*'], message: 'src/domain is pure: no database.' },
  { group: ['three', 'three/*'], message: 'src/domain is pure: the 3D view converts at its edge.' },
  { group: ['pdfkit', 'pdfkit/*'], message: 'src/domain is pure: PDFs only draw domain results.' },
  { group: ['node:*', 'fs', 'path', 'os', 'crypto', 'child_process', 'worker_threads'], message: 'src/domain is pure: no Node built-ins.' },
  { group: ['**/server/**', '**/features/**', '**/lib/**'], message: 'src/domain depends on nothing outside it.' },
];

export default tseslint.config(
  { ignores: ['dist/**', 'node_modules/**', '.data/**', 'coverage/**', 'public/**'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    languageOptions: { globals: { ...globals.node, ...globals.browser } },
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_', caughtErrorsIgnorePattern: '^_' }],
      '@typescript-eslint/consistent-type-imports': ['error', { fixStyle: 'inline-type-imports' }],
    },
  },
  {
    files: ['src/**/*.{ts,tsx}'],
    plugins: { 'react-hooks': reactHooks },
    rules: {
      'react-hooks/rules-of-hooks': 'error',
      'react-hooks/exhaustive-deps': 'warn',
    },
  },
  {
    files: ['src/domain/**/*.ts'],
    rules: {
      'no-restricted-imports': ['error', { patterns: forbiddenInDomain }],
      'no-restricted-globals': ['error', { name: 'process', message: 'src/domain is pure: no process.' }, { name: 'Buffer', message: 'src/domain is pure: use Uint8Array.' }],
    },
  },
);
