// @ts-check
import js from '@eslint/js';
import pluginQuery from '@tanstack/eslint-plugin-query';
import reactHooks from 'eslint-plugin-react-hooks';
import globals from 'globals';
import tseslint from 'typescript-eslint';

/** Import direction from architecture.md: client → shared; server → shared, sandbox; sandbox → shared. */
const forbid = (...groups) => ({
  'no-restricted-imports': [
    'error',
    {
      patterns: groups.map((g) => ({
        group: [`@${g}/*`, `**/${g}/*`],
        message: `This layer must not import from ${g}/ (see architecture.md).`,
      })),
    },
  ],
});

export default tseslint.config(
  {
    ignores: [
      'node_modules',
      'dist',
      '.data',
      '.test-output',
      'server/db/migrations',
      'benchmarks/results',
    ],
  },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    languageOptions: { globals: { ...globals.node } },
    rules: {
      '@typescript-eslint/no-unused-vars': [
        'error',
        { argsIgnorePattern: '^_', varsIgnorePattern: '^_' },
      ],
      '@typescript-eslint/consistent-type-imports': 'error',
    },
  },
  {
    files: ['client/**/*.{ts,tsx}'],
    languageOptions: { globals: { ...globals.browser } },
    plugins: { 'react-hooks': reactHooks, '@tanstack/query': pluginQuery },
    rules: {
      ...reactHooks.configs.recommended.rules,
      ...pluginQuery.configs.recommended.rules,
      ...forbid('server', 'sandbox'),
    },
  },
  { files: ['server/**/*.ts'], rules: forbid('client') },
  { files: ['sandbox/**/*.ts'], rules: forbid('client', 'server') },
  { files: ['shared/**/*.ts'], rules: forbid('client', 'server', 'sandbox') },
);
