import { readdirSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import js from '@eslint/js';
import { createTypeScriptImportResolver } from 'eslint-import-resolver-typescript';
import { importX } from 'eslint-plugin-import-x';
import reactHooks from 'eslint-plugin-react-hooks';
import globals from 'globals';
import tseslint from 'typescript-eslint';

/** Every folder in src/features is a feature: it may import its own folder, never another's. */
const FEATURES = readdirSync(new URL('./src/features', import.meta.url), { withFileTypes: true })
  .filter((entry) => entry.isDirectory())
  .map((entry) => entry.name);

/**
 * The client's one-way flow, checked on resolved paths (so `@/features/x`, `../../x` and
 * `src/features/x` are all caught): shared pieces (src/components, src/lib, src/config) ← features
 * ← src/app. A feature may use the shared pieces, shared/ and its own folder; routes in src/app
 * compose features.
 */
const CLIENT_ZONES = [
  ...FEATURES.map((feature) => ({
    target: `./src/features/${feature}`,
    from: './src/features',
    except: [`./${feature}`],
    message: `Features don't import each other: compose them in a route under src/app, or move what both need to src/components, src/lib or shared/.`,
  })),
  {
    target: './src/features',
    from: './src/app',
    message: 'Features are composed by src/app, never the other way round.',
  },
  {
    target: ['./src/components', './src/lib', './src/config'],
    from: ['./src/features', './src/app'],
    message:
      'src/components, src/lib and src/config are shared by every feature: they import none.',
  },
];

export default tseslint.config(
  { ignores: ['dist', 'node_modules', 'data', 'coverage', 'test-results', 'playwright-report'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    rules: {
      '@typescript-eslint/no-unused-vars': [
        'error',
        { argsIgnorePattern: '^_', varsIgnorePattern: '^_', destructuredArrayIgnorePattern: '^_' },
      ],
    },
  },
  {
    files: ['src/**/*.{ts,tsx}'],
    languageOptions: { globals: globals.browser },
    plugins: { 'react-hooks': reactHooks, 'import-x': importX },
    settings: {
      'import-x/resolver-next': [
        createTypeScriptImportResolver({
          project: fileURLToPath(new URL('./tsconfig.app.json', import.meta.url)),
        }),
      ],
    },
    rules: {
      ...reactHooks.configs.recommended.rules,
      'import-x/no-restricted-paths': ['error', { zones: CLIENT_ZONES }],
      // One-way flow: the client never reaches into the server.
      'no-restricted-imports': [
        'error',
        {
          paths: [
            {
              name: 'react-router',
              message:
                'Import from react-router-dom, the package Loomwright depends on (v7 re-exports react-router).',
            },
          ],
          patterns: [
            {
              group: ['**/server/**', '#server/*'],
              message: 'The client cannot import server code.',
            },
          ],
        },
      ],
    },
  },
  {
    files: ['shared/**/*.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            {
              group: [
                '**/server/**',
                '#server/*',
                '**/src/**',
                '@/*',
                'react',
                'express',
                'sequelize',
              ],
              message: 'shared/ holds pure code used by both sides.',
            },
          ],
        },
      ],
    },
  },
  {
    files: [
      'server/**/*.ts',
      'seeds/**/*.ts',
      'tests/**/*.ts',
      'scripts/**/*.ts',
      'bench/**/*.ts',
      '*.config.ts',
      '*.config.js',
    ],
    languageOptions: { globals: globals.node },
  },
);
