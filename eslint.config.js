// @ts-check
import js from '@eslint/js';
import tseslint from 'typescript-eslint';
import reactHooks from 'eslint-plugin-react-hooks';
import jsxA11y from 'eslint-plugin-jsx-a11y';
import globals from 'globals';

export default tseslint.config(
  {
    ignores: [
      '**/node_modules/**',
      '**/dist/**',
      '.data/**',
      'coverage/**',
      'test-results/**',
      'playwright-report/**',
      'apps/web/dev-dist/**',
    ],
  },
  js.configs.recommended,
  ...tseslint.configs.recommendedTypeChecked,
  {
    languageOptions: {
      parserOptions: { projectService: true, tsconfigRootDir: import.meta.dirname },
      globals: { ...globals.node },
    },
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
      '@typescript-eslint/consistent-type-imports': 'error',
      '@typescript-eslint/no-misused-promises': ['error', { checksVoidReturn: { attributes: false } }],
      'no-restricted-properties': [
        'error',
        { object: 'process', property: 'env', message: 'Read configuration through config/env.ts only.' },
      ],
    },
  },
  {
    files: ['**/*.{js,mjs,cjs}'],
    ...tseslint.configs.disableTypeChecked,
  },
  {
    // The places allowed to read the environment: each app's config module, scripts and test harnesses.
    files: [
      'apps/api/src/config/env.ts',
      'apps/web/vite.config.ts',
      'scripts/**',
      'tests/**',
      'playwright.config.ts',
      '**/*.{js,mjs,cjs}',
    ],
    rules: { 'no-restricted-properties': 'off' },
  },
  {
    // Response bodies in tests are untyped JSON read through assertions.
    files: ['tests/**/*.ts', '**/*.test.{ts,tsx}', '**/*.spec.ts'],
    rules: {
      '@typescript-eslint/no-unsafe-member-access': 'off',
      '@typescript-eslint/no-unsafe-assignment': 'off',
      '@typescript-eslint/no-unsafe-call': 'off',
      '@typescript-eslint/no-unsafe-argument': 'off',
      '@typescript-eslint/no-unsafe-return': 'off',
    },
  },
  {
    files: ['apps/web/**/*.{ts,tsx}'],
    languageOptions: { globals: { ...globals.browser } },
    plugins: { 'react-hooks': reactHooks, 'jsx-a11y': jsxA11y },
    rules: {
      ...reactHooks.configs.recommended.rules,
      ...jsxA11y.flatConfigs.recommended.rules,
      'no-restricted-imports': [
        'error',
        { patterns: [{ group: ['**/apps/api/**', '@stringfield/api'], message: 'The web app never imports the API.' }] },
      ],
    },
  },
  {
    files: ['apps/web/src/features/*/**/*.{ts,tsx}'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            { group: ['**/features/*/**', '@/features/*'], message: 'A feature never imports another feature; compose them in src/app/routes.' },
          ],
        },
      ],
    },
  },
  {
    files: ['apps/api/**/*.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        { patterns: [{ group: ['**/apps/web/**', '@stringfield/web'], message: 'The API never imports the web app.' }] },
      ],
    },
  },
  {
    files: ['packages/pv/**/*.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        { patterns: [{ group: ['@stringfield/*', 'node:*', 'fs', 'path'], message: 'packages/pv imports nothing of ours and does no I/O.' }] },
      ],
    },
  },
);
