// Lint rules for the whole repository: TypeScript everywhere, React hooks and TanStack Query rules on the client.
import js from '@eslint/js';
import tseslint from 'typescript-eslint';
import reactHooks from 'eslint-plugin-react-hooks';
import pluginQuery from '@tanstack/eslint-plugin-query';
import globals from 'globals';

export default tseslint.config(
  { ignores: ['dist/**', 'node_modules/**', '.local/**', 'test-results/**'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    languageOptions: { globals: { ...globals.node }, ecmaVersion: 2023, sourceType: 'module' },
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
      '@typescript-eslint/no-explicit-any': 'error',
    },
  },
  {
    files: ['client/**/*.{ts,tsx}'],
    languageOptions: { globals: { ...globals.browser } },
    plugins: { 'react-hooks': reactHooks, '@tanstack/query': pluginQuery },
    rules: {
      ...reactHooks.configs.recommended.rules,
      ...pluginQuery.configs.recommended.rules,
    },
  },
  {
    // Features stay independent: a feature may use shared code and ui components, never another feature.
    files: ['client/src/features/**/*.{ts,tsx}'],
    rules: {
      // From features/<a>/<dir>/file, "../../<b>/…" reaches another feature; "../../../lib" is the shared layer.
      'no-restricted-imports': ['error', { patterns: [{ regex: '^\\.\\./\\.\\./(?!\\.\\./)', message: 'A feature must not import another feature; move shared code to lib/ or components/.' }] }],
    },
  },
  {
    // shared/ runs in the browser and in Node: no platform APIs.
    files: ['shared/**/*.ts'],
    ignores: ['shared/**/*.test.ts'],
    rules: {
      'no-restricted-imports': ['error', { patterns: [{ group: ['node:*', 'fs', 'path', 'react', 'react-dom'], message: 'shared/ is platform-free.' }] }],
    },
  },
);
