import { readdirSync } from 'node:fs';
import js from '@eslint/js';
import { createTypeScriptImportResolver } from 'eslint-import-resolver-typescript';
import { importX } from 'eslint-plugin-import-x';
import pluginQuery from '@tanstack/eslint-plugin-query';
import reactHooks from 'eslint-plugin-react-hooks';
import globals from 'globals';
import tseslint from 'typescript-eslint';

const features = readdirSync(new URL('./frontend/src/features', import.meta.url), { withFileTypes: true })
  .filter((entry) => entry.isDirectory())
  .map((entry) => entry.name);

const restrict = (patterns) => ({ 'no-restricted-imports': ['error', { patterns }] });

/** A feature reaches another only through the app's router; shared code never reaches a feature or the app. */
const boundaries = [
  ...features.map((feature) => ({
    files: [`frontend/src/features/${feature}/**/*.{ts,tsx}`],
    rules: restrict([
      {
        group: features
          .filter((other) => other !== feature)
          .flatMap((other) => [`@/features/${other}`, `@/features/${other}/**`, `**/features/${other}/**`]),
        message: 'No imports across features: move what both need to src/components, src/lib or @meritline/shared.',
      },
      { group: ['@/app', '@/app/**', '**/src/app/**'], message: 'A feature does not import the app shell.' },
    ]),
  })),
  {
    files: ['frontend/src/components/**/*.{ts,tsx}', 'frontend/src/lib/**/*.{ts,tsx}'],
    rules: restrict([
      {
        group: ['@/features/**', '@/app/**', '**/features/**', '**/src/app/**'],
        message: 'Shared frontend code never imports a feature or the app.',
      },
    ]),
  },
  {
    files: ['shared/src/**/*.ts'],
    rules: restrict([
      {
        group: ['**/backend/**', '**/frontend/**', '@meritline/backend', '@meritline/frontend'],
        message: 'The shared package never imports the backend or the frontend.',
      },
    ]),
  },
];

export default tseslint.config(
  {
    ignores: [
      '**/dist/**',
      '**/node_modules/**',
      '**/test-output/**',
      '**/playwright-report/**',
      'data/**',
      '**/*.js',
      '**/*.mjs',
      '**/*.cjs',
    ],
  },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    files: ['**/*.ts', '**/*.tsx'],
    languageOptions: {
      globals: { ...globals.node },
      parserOptions: { projectService: true, tsconfigRootDir: import.meta.dirname },
    },
    rules: {
      '@typescript-eslint/no-floating-promises': 'error',
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
      'no-console': ['error', { allow: ['error', 'warn'] }],
    },
  },
  {
    files: ['frontend/**/*.{ts,tsx}'],
    languageOptions: { globals: { ...globals.browser } },
    plugins: { 'react-hooks': reactHooks },
    rules: { ...reactHooks.configs.recommended.rules },
  },
  ...pluginQuery.configs['flat/recommended'],
  {
    files: ['shared/src/**/*.ts', 'backend/src/**/*.ts', 'frontend/src/**/*.{ts,tsx}'],
    // TypeORM's two-sided relations name each other lazily (() => Entity): the one cycle the framework asks for.
    ignores: ['backend/src/**/*.entity.ts'],
    plugins: { 'import-x': importX },
    settings: {
      'import-x/extensions': ['.ts', '.tsx'],
      'import-x/parsers': { '@typescript-eslint/parser': ['.ts', '.tsx'] },
      'import-x/resolver-next': [
        createTypeScriptImportResolver({ project: ['shared/tsconfig.json', 'backend/tsconfig.json', 'frontend/tsconfig.json'] }),
      ],
    },
    rules: { 'import-x/no-cycle': ['error', { ignoreExternal: true }] },
  },
  ...boundaries,
  {
    files: ['backend/src/**/*.ts'],
    ignores: ['backend/src/database/write-transaction.ts'],
    rules: {
      'no-restricted-syntax': [
        'error',
        {
          selector: "CallExpression[callee.property.name='transaction'][callee.object.property.name=/^(dataSource|manager)$/]",
          message: 'Writes take their turn in the one write queue: use writeTransaction() from database/write-transaction.',
        },
      ],
    },
  },
  {
    files: ['shared/src/cli.ts', 'shared/src/bench/**', 'backend/src/main.ts'],
    rules: { 'no-console': 'off' },
  },
);
