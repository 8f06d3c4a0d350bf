import js from '@eslint/js';
import tseslint from 'typescript-eslint';
import reactHooks from 'eslint-plugin-react-hooks';
import globals from 'globals';
import { layersPlugin } from './lint/layerImports.js';

export default tseslint.config(
  { ignores: ['dist', 'node_modules', 'data', '.tmp', 'test-results', 'playwright-report', 'dev-dist'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    files: ['**/*.{ts,tsx}'],
    languageOptions: { ecmaVersion: 2022 },
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
      '@typescript-eslint/consistent-type-imports': 'error',
      'no-console': 'off',
    },
  },
  {
    files: ['src/**/*.{ts,tsx}', 'tests/client/**/*.{ts,tsx}'],
    languageOptions: { globals: globals.browser },
    plugins: { 'react-hooks': reactHooks },
    rules: reactHooks.configs.recommended.rules,
  },
  {
    // The shared rules must run unchanged in the browser and in Node.
    files: ['src/core/**/*.ts', 'src/contract/**/*.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            {
              group: ['react', 'react-dom', 'express', 'knex', 'better-sqlite3', 'dexie', 'node:*'],
              message: 'src/core and src/contract stay free of UI, server and platform code.',
            },
          ],
        },
      ],
    },
  },
  {
    // Layers that show in the folders: features stay apart, shared code stays below them.
    files: ['src/**/*.{ts,tsx}'],
    plugins: { layers: layersPlugin },
    rules: { 'layers/layer-imports': 'error' },
  },
  {
    files: [
      'server/**/*.ts',
      'migrations/**/*.ts',
      'tests/{server,e2e,support,lint}/**/*.ts',
      'bench/**/*.ts',
      'scripts/**/*.ts',
      'lint/**/*.js',
      '*.config.{ts,js}',
    ],
    languageOptions: { globals: globals.node },
  },
);
