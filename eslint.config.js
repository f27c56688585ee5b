import js from '@eslint/js';
import reactHooks from 'eslint-plugin-react-hooks';
import globals from 'globals';
import tseslint from 'typescript-eslint';

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
    plugins: { 'react-hooks': reactHooks },
    rules: {
      ...reactHooks.configs.recommended.rules,
      // One-way flow: the client never reaches into the server.
      'no-restricted-imports': [
        'error',
        {
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
    ],
    languageOptions: { globals: globals.node },
  },
);
