// `npm run lint` (with Prettier and knip). Why these rules and why some are off: docs/decisions/011-lint-and-code-habits.md.
import js from '@eslint/js';
import astro from 'eslint-plugin-astro';
import drizzle from 'eslint-plugin-drizzle';
import reactHooks from 'eslint-plugin-react-hooks';
import globals from 'globals';
import tseslint from 'typescript-eslint';

const TS = ['**/*.ts', '**/*.tsx', '**/*.mts'];

export default tseslint.config(
  { ignores: ['dist/', '.astro/', 'node_modules/', 'drizzle/', 'data/', 'coverage/', 'test-results/'] },
  { linterOptions: { reportUnusedDisableDirectives: 'error' } },
  js.configs.recommended,
  // Our sanitisers (links, file names) match control characters on purpose; that is what the rule forbids.
  { rules: { 'no-control-regex': 'off' } },
  { languageOptions: { globals: { ...globals.node } } },
  {
    files: TS,
    extends: [tseslint.configs.recommendedTypeChecked],
    languageOptions: { parserOptions: { projectService: true, tsconfigRootDir: import.meta.dirname } },
    rules: {
      // React ignores what an event handler returns, and every async handler here catches its own errors.
      '@typescript-eslint/no-misused-promises': ['error', { checksVoidReturn: { attributes: false } }],
    },
  },
  {
    // Tests read JSON answers as `any` through tests/setup/http.ts on purpose: the expect() is the type check.
    files: ['tests/**/*.ts'],
    rules: {
      '@typescript-eslint/no-unsafe-argument': 'off',
      '@typescript-eslint/no-unsafe-assignment': 'off',
      '@typescript-eslint/no-unsafe-call': 'off',
      '@typescript-eslint/no-unsafe-member-access': 'off',
      '@typescript-eslint/no-unsafe-return': 'off',
    },
  },
  {
    files: ['src/islands/**/*.{ts,tsx}', 'src/lib/client/**/*.ts'],
    languageOptions: { globals: { ...globals.browser } },
  },
  {
    files: ['src/islands/**/*.{ts,tsx}'],
    plugins: { 'react-hooks': reactHooks },
    rules: reactHooks.configs.recommended.rules,
  },
  {
    files: TS,
    plugins: { drizzle },
    rules: {
      'drizzle/enforce-update-with-where': ['error', { drizzleObjectName: ['db', 'tx'] }],
      'drizzle/enforce-delete-with-where': ['error', { drizzleObjectName: ['db', 'tx'] }],
    },
  },
  ...astro.configs['flat/recommended'],
);
