// ESLint (flat config): correctness rules, React hooks rules for the client, no import cycles, and the layer
// boundaries of DEVELOPERS.md ("imports point inward"). Untyped linting (no type information) to stay fast;
// `npm run lint` runs this and then `tsc` for the types. Purely stylistic rules are off.
// The same boundaries are also checked, without ESLint, by tests/unit/import-graph.test.ts.
import js from '@eslint/js';
import { createNodeResolver, importX } from 'eslint-plugin-import-x';
import reactHooks from 'eslint-plugin-react-hooks';
import globals from 'globals';
import { defineConfig } from 'eslint/config';
import fs from 'node:fs';
import { builtinModules } from 'node:module';
import path from 'node:path';
import tseslint from 'typescript-eslint';

/** src/features/<feature> folders, read at lint time so a new feature is covered without editing this file. */
const FEATURES = fs
  .readdirSync(path.join(import.meta.dirname, 'src/features'), { withFileTypes: true })
  .filter((d) => d.isDirectory())
  .map((d) => d.name);

/** Packages `shared/` may not use: UI, HTTP, database, DOM-only and Node modules. */
const SHARED_FORBIDDEN_PACKAGES = [
  'react', 'react/*', 'react-dom', 'react-dom/*', 'react-router', 'react-router-dom', '@tanstack/*', 'recharts', '@fontsource/*',
  'express', 'express-*', 'helmet', 'multer', 'passport', 'passport-*', 'supertest',
  'typeorm', 'typeorm/*', 'better-sqlite3', 'reflect-metadata',
  'sharp', 'pdfkit', 'nodemailer', 'mailparser', 'smtp-server',
  'node:*', ...builtinModules.filter((m) => !m.startsWith('_')).flatMap((m) => [m, `${m}/*`]),
];

/** Browser-only globals `shared/` may not touch. */
const DOM_GLOBALS = ['window', 'document', 'navigator', 'localStorage', 'sessionStorage', 'location', 'HTMLElement', 'HTMLCanvasElement', 'Image'];

/** import-x/no-restricted-paths zones (paths are resolved, so relative imports are caught too). */
const zones = [
  { target: './shared', from: './src', message: 'shared/ imports nothing of src/.' },
  { target: './shared', from: './server', message: 'shared/ imports nothing of server/.' },
  { target: './server/services', from: './server/modules', message: 'server/services never imports server/modules.' },
  { target: './src', from: './server', message: 'src/ never imports server/.' },
  { target: './server', from: './src', message: 'server/ never imports src/.' },
  ...FEATURES.map((f) => ({
    target: `./src/features/${f}`,
    from: './src/features',
    except: [`./${f}`],
    message: 'Features do not import each other: move what both need to src/components, src/lib or shared/.',
  })),
];

export default defineConfig(
  { ignores: ['dist/**', 'node_modules/**', 'test-output/**', 'data/**', 'coverage/**', 'public/**', '.tmp/**'] },

  js.configs.recommended,
  tseslint.configs.recommended,

  {
    languageOptions: { ecmaVersion: 2023, sourceType: 'module', globals: { ...globals.node } },
    linterOptions: { reportUnusedDisableDirectives: 'error' },
    rules: {
      // correctness, kept
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_', caughtErrors: 'none', ignoreRestSiblings: true }],
      'prefer-const': ['error', { destructuring: 'all' }],
      // not bugs, or already checked by tsc
      '@typescript-eslint/no-explicit-any': 'off',
      '@typescript-eslint/no-non-null-assertion': 'off',
      '@typescript-eslint/no-empty-object-type': 'off',
      '@typescript-eslint/no-namespace': 'off',
      '@typescript-eslint/no-unsafe-declaration-merging': 'off',
      'no-undef': 'off', // tsc does this, with the right globals
      'no-empty': ['error', { allowEmptyCatch: true }],
      'no-control-regex': 'off',
    },
  },

  // Import cycles and layer boundaries, for the app's code.
  {
    files: ['src/**/*.{ts,tsx}', 'server/**/*.ts', 'shared/**/*.ts'],
    plugins: { 'import-x': importX },
    settings: {
      'import-x/extensions': ['.ts', '.tsx', '.js', '.json'],
      'import-x/parsers': { '@typescript-eslint/parser': ['.ts', '.tsx'] },
      'import-x/resolver-next': [createNodeResolver({ extensions: ['.ts', '.tsx', '.js', '.json'] })],
    },
    rules: {
      'import-x/no-cycle': ['error', { ignoreExternal: true }],
      'import-x/no-restricted-paths': ['error', { zones }],
    },
  },

  // shared/: a pure engine.
  {
    files: ['shared/**/*.ts'],
    languageOptions: { globals: {} },
    rules: {
      '@typescript-eslint/no-restricted-imports': ['error', {
        patterns: [{ group: SHARED_FORBIDDEN_PACKAGES, message: 'shared/ is a pure engine: no React, Express, TypeORM, DOM-only or Node modules.' }],
      }],
      'no-restricted-globals': ['error', ...DOM_GLOBALS.map((name) => ({ name, message: 'shared/ runs in the browser and on the server: no DOM globals.' }))],
    },
  },

  // The client: browser globals and the React hooks rules.
  {
    files: ['src/**/*.{ts,tsx}'],
    plugins: { 'react-hooks': reactHooks },
    languageOptions: { globals: { ...globals.browser } },
    rules: {
      'react-hooks/rules-of-hooks': 'error',
      'react-hooks/exhaustive-deps': 'error',
    },
  },
);
