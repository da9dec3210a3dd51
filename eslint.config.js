/**
 * Lint configuration (ESLint flat config): typescript-eslint's recommended rules, the layer table of the
 * source folders, and no import cycles. `npm run lint` runs it; `npm test` runs it before the unit tests.
 *
 * Layers (each folder of src/ may import only from the folders listed; tests, benches and browser tests
 * are not layers and may import anything):
 *
 *   engine   -> (nothing of ours outside engine)
 *   problems -> engine
 *   io       -> engine, problems
 *   protocol -> engine, problems                 (message types between page and workers)
 *   worker   -> protocol, problems, engine, io
 *   client   -> protocol, problems, engine           (page-side worker clients: grid pool, study pool)
 *   store    -> protocol, client, io, problems, engine
 *   ui       -> store, io, problems, engine, protocol
 *   cli      -> io, problems, engine
 *
 * src/main.tsx, which wires the page together, belongs to no layer and is not checked.
 *
 * Boundaries are checked by eslint-plugin-boundaries rather than dependency-cruiser: it runs inside
 * ESLint (one command, one report, errors shown in the editor at the offending import) and its element
 * table reads as the table above. It does not look for cycles; our own rule `local/no-import-cycle`
 * (scripts/lint/) does, counting type-only imports, which eslint-plugin-import-x's `no-cycle` skips.
 *
 * test/fixtures/lint/ holds files that break the table on purpose (test/lint/boundaries.test.ts lints
 * them through ESLint's Node API and expects the errors); they are ignored here.
 */
import js from '@eslint/js';
import tseslint from 'typescript-eslint';
import boundaries from 'eslint-plugin-boundaries';
import local from './scripts/lint/no-import-cycle.js';

const layers = [
  { type: 'client', pattern: 'src/client' },
  { type: 'engine', pattern: 'src/engine' },
  { type: 'problems', pattern: 'src/problems' },
  { type: 'io', pattern: 'src/io' },
  { type: 'protocol', pattern: 'src/protocol' },
  { type: 'worker', pattern: 'src/worker' },
  { type: 'store', pattern: 'src/store' },
  { type: 'ui', pattern: 'src/ui' },
  { type: 'cli', pattern: 'src/cli' },
];

const mayImport = {
  engine: [],
  problems: ['engine'],
  io: ['engine', 'problems'],
  protocol: ['engine', 'problems'],
  worker: ['protocol', 'problems', 'engine', 'io'],
  client: ['protocol', 'problems', 'engine'],
  store: ['protocol', 'client', 'io', 'problems', 'engine'],
  ui: ['store', 'io', 'problems', 'engine', 'protocol'],
  cli: ['io', 'problems', 'engine'],
};

export default tseslint.config(
  { ignores: ['dist/**', 'dist-cli/**', 'node_modules/**', 'test-results/**', 'playwright-report/**', 'coverage/**', 'test/fixtures/lint/**', 'bench/.cache/**', 'e2e-results/**', 'logs/**'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    files: ['**/*.{ts,tsx,js,mjs}'],
    languageOptions: { ecmaVersion: 2022, sourceType: 'module', globals: { console: 'readonly', process: 'readonly' } },
    rules: {
      // Arguments are kept to honour a fixed signature (callbacks, handlers); `_`-prefixed names on purpose.
      '@typescript-eslint/no-unused-vars': ['error', { args: 'none', varsIgnorePattern: '^_', caughtErrors: 'none' }],
      // TypeScript reports undefined names itself, knowing the DOM, worker and Node globals.
      'no-undef': 'off',
      // The JSON reader and the SVG writer match control characters on purpose (to refuse or escape them).
      'no-control-regex': 'off',
      // Reference values are kept with the digits their source prints; the parser's rounding is intended.
      'no-loss-of-precision': 'off',
      // A store is declared before the callbacks that read it and assigned once after (`let store!`).
      'prefer-const': ['error', { ignoreReadBeforeAssign: true }],
    },
  },
  {
    files: ['test/**/*.ts', 'e2e/**/*.ts'],
    // Tests read untyped JSON (saved files, parsed output) and poke at it on purpose.
    rules: { '@typescript-eslint/no-explicit-any': 'off' },
  },
  {
    files: ['src/**/*.{ts,tsx}'],
    plugins: { boundaries, local },
    settings: {
      'boundaries/elements': layers,
      'boundaries/include': ['src/**/*'],
      'import/resolver': { node: { extensions: ['.ts', '.tsx'] } },
    },
    rules: {
      'boundaries/dependencies': [
        'error',
        {
          default: 'disallow',
          policies: [
            ...Object.entries(mayImport).map(([from, to]) => ({
              from: { element: { type: from } },
              allow: { to: { element: { types: { anyOf: [from, ...to] } } } },
            })),
          ],
        },
      ],
      'local/no-import-cycle': 'error',
    },
  },
);
