// The house rules that a machine can check: TypeScript's recommended rules, the React hooks
// rules, and which part of the code may import which (docs/decisions/2026-12-03-boundaries.md).
import js from '@eslint/js';
import boundaries from 'eslint-plugin-boundaries';
import reactHooks from 'eslint-plugin-react-hooks';
import { defineConfig, globalIgnores } from 'eslint/config';
import globals from 'globals';
import tseslint from 'typescript-eslint';

/** A server feature's files that others may import: its entities, services, views and mails. */
const SERVER_PUBLIC = '{*.entity.ts,*.service.ts,*.views.ts,*-mail.ts}';
/** A client feature shows other features only its index.ts. */
const CLIENT_PUBLIC = 'index.ts';

const CLIENT = ['client-app', 'client-feature', 'client-components', 'client-lib', 'client'];
const SERVER = ['server-feature', 'server'];

export default defineConfig([
  globalIgnores(['dist/', '.data/', 'scratch/', 'coverage/']),
  js.configs.recommended,
  tseslint.configs.recommended,
  { languageOptions: { globals: globals.node } },
  {
    files: ['src/**/*.{ts,tsx}', 'tests/browser/**/*.ts'],
    languageOptions: { globals: { ...globals.browser, ...globals.node } },
  },
  {
    files: ['src/**/*.{ts,tsx}'],
    plugins: { 'react-hooks': reactHooks },
    rules: { 'react-hooks/rules-of-hooks': 'error', 'react-hooks/exhaustive-deps': 'error' },
  },
  {
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_', caughtErrors: 'none' }],
    },
  },
  {
    files: ['**/*.{ts,tsx,mjs,js}'],
    plugins: { boundaries },
    settings: {
      'import/resolver': {
        typescript: { project: ['tsconfig.json', 'src/tsconfig.json', 'tests/browser/tsconfig.json'], noWarnOnMultipleProjects: true },
      },
      'boundaries/root-path': import.meta.dirname,
      // Each part of the project by its folder from the root (partialMatch: false, so a folder
      // named like a part deeper down, tests/integration/fakes say, stays in its own part).
      'boundaries/elements': [
        { type: 'server-feature', pattern: 'server/features/*', capture: ['feature'] },
        { type: 'server-scripts', pattern: 'server/scripts' },
        { type: 'server', pattern: 'server' },
        { type: 'client-feature', pattern: 'src/features/*', capture: ['feature'] },
        { type: 'client-app', pattern: 'src/app' },
        { type: 'client-components', pattern: 'src/components' },
        { type: 'client-lib', pattern: 'src/lib' },
        { type: 'client', pattern: 'src' },
        { type: 'shared', pattern: 'shared' },
        { type: 'fakes', pattern: 'fakes' },
        { type: 'tests', pattern: 'tests' },
      ].map((element) => ({ ...element, partialMatch: false })),
    },
    rules: {
      'boundaries/dependencies': [
        'error',
        {
          default: 'allow',
          policies: [
            {
              // Shared code runs in the browser, a Web Worker and Node alike.
              from: { element: { type: 'shared' } },
              disallow: { to: { element: { type: '!shared' } } },
              message: 'shared/ imports only shared/: it runs in the browser, a Web Worker and Node.',
            },
            {
              from: { element: { types: { anyOf: CLIENT } } },
              disallow: { to: { element: { types: { anyOf: [...SERVER, 'fakes', 'tests'] } } } },
              message: 'The client imports shared/, never the server.',
            },
            {
              from: { element: { types: { anyOf: [...SERVER, 'fakes'] } } },
              disallow: { to: { element: { types: { anyOf: [...CLIENT, 'tests'] } } } },
              message: 'The server imports shared/, never the client or the tests.',
            },
            {
              // The stand-ins are libraries of their own, to be swapped for the real services.
              from: { element: { type: 'fakes' } },
              disallow: { to: { element: { type: '!fakes' } } },
              message: 'fakes/ stand alone: they import nothing of the product.',
            },
            {
              from: { element: { types: { anyOf: ['client-components', 'client-lib'] } } },
              disallow: { to: { element: { types: { anyOf: ['client-feature', 'client-app'] } } } },
              message: 'src/components and src/lib are the bottom layer: they import no feature and no route.',
            },
            {
              from: { element: { type: 'client-feature' } },
              disallow: { to: { element: { type: 'client-app' } } },
              message: 'A feature does not import routes.',
            },
            {
              from: { element: { type: 'client-feature' } },
              disallow: {
                to: {
                  element: {
                    type: 'client-feature',
                    captured: { feature: '!{{ from.element.captured.feature }}' },
                    fileInternalPath: `!${CLIENT_PUBLIC}`,
                  },
                },
              },
              message: `Another client feature is reached only through its ${CLIENT_PUBLIC}.`,
            },
            {
              from: { element: { type: 'server-feature' } },
              disallow: {
                to: {
                  element: {
                    type: 'server-feature',
                    captured: { feature: '!{{ from.element.captured.feature }}' },
                    fileInternalPath: `!${SERVER_PUBLIC}`,
                  },
                },
              },
              message: 'Another server feature is reached only through its entities, services, views and mails.',
            },
          ],
        },
      ],
    },
  },
]);
