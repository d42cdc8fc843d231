// Lint rules for the whole repository: TypeScript everywhere, React hooks and TanStack Query rules on the client.
import js from '@eslint/js';
import tseslint from 'typescript-eslint';
import reactHooks from 'eslint-plugin-react-hooks';
import pluginQuery from '@tanstack/eslint-plugin-query';
import globals from 'globals';
import boundaries from 'eslint-plugin-boundaries';

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
    // One-way layers on the client: app composes features; a feature uses lib/, components/ui/ and @shared, never
    // another feature or the app; lib/ and ui/ know no feature. Checked on resolved paths, so any import spelling counts.
    files: ['client/src/**/*.{ts,tsx}'],
    plugins: { boundaries },
    settings: {
      'import/resolver': { node: { extensions: ['.ts', '.tsx', '.js'] } },
      'boundaries/elements': [
        { type: 'feature', pattern: 'client/src/features/*', capture: ['name'] },
        { type: 'app', pattern: 'client/src/app' },
        { type: 'lib', pattern: 'client/src/lib' },
        { type: 'ui', pattern: 'client/src/components/ui' },
        { type: 'shared', pattern: 'shared' },
      ],
    },
    rules: {
      'boundaries/dependencies': [2, {
        default: 'allow',
        policies: [
          {
            from: { element: { type: 'feature' } },
            disallow: { to: { element: { types: { anyOf: ['feature', 'app'] } } } },
            message: 'A feature must not import another feature or the app; move shared code to lib/ or components/ui/.',
          },
          {
            from: { element: { types: { anyOf: ['lib', 'ui', 'shared'] } } },
            disallow: { to: { element: { types: { anyOf: ['feature', 'app'] } } } },
            message: 'lib/, components/ui/ and shared/ sit below the features and know none of them.',
          },
        ],
      }],
    },
  },
  {
    // Money moves in one module on the server: payments (with its payouts, counter payments and the provider's client)
    // owns every movement and lets others read it through payments/reader only; finance reads, it never calls the
    // provider or payments' other files, and payments never imports finance.
    // HTTP stays at the edge: only route files, server/src/http itself and the composition (app.ts, main.ts) import
    // server/src/http; services throw domain errors (server/src/domain/errors.ts) and the edge maps them to statuses.
    files: ['server/src/**/*.ts'],
    plugins: { boundaries },
    settings: {
      'import/resolver': { node: { extensions: ['.ts', '.js'] } },
      'boundaries/elements': [
        { type: 'payments-read', pattern: 'server/src/modules/payments/reader' },
        { type: 'payments', pattern: 'server/src/modules/(payments|payouts|counter-payments)' },
        { type: 'payments', pattern: 'server/src/integrations/payments' },
        { type: 'finance', pattern: 'server/src/modules/finance' },
        { type: 'http', pattern: 'server/src/http' },
        { type: 'module', pattern: 'server/src/modules/*', capture: ['name'] },
        { type: 'server', pattern: 'server/src/*' },
      ],
      'boundaries/files': [{ category: 'routes', pattern: '**/*.routes.ts' }],
    },
    rules: {
      'boundaries/dependencies': [2, {
        default: 'allow',
        policies: [
          {
            from: { element: { type: 'finance' } },
            disallow: { to: { element: { type: 'payments' } } },
            message: 'Finance reads money movements through server/src/modules/payments/reader only.',
          },
          {
            from: { element: { types: { anyOf: ['payments', 'payments-read'] } } },
            disallow: { to: { element: { type: 'finance' } } },
            message: 'The payments module must not import finance: finance reads payments, not the other way round.',
          },
          {
            from: { element: { types: { anyOf: ['payments', 'payments-read', 'finance', 'module', 'server'] } } },
            disallow: { to: { element: { type: 'http' } } },
            message: 'Only *.routes.ts, server/src/http and app.ts/main.ts may import server/src/http: throw a domain error from server/src/domain/errors.ts and let the edge map it.',
          },
          {
            // Later policies win: a route file is the edge of its module.
            from: { file: { categories: 'routes' } },
            allow: { to: { element: { type: 'http' } } },
          },
        ],
      }],
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
