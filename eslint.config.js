// @ts-check
/**
 * One lint for the whole project, type-aware (typescript-eslint with the project's tsconfig),
 * with React's hook rules for the client and two boundaries:
 * - shared/thermal is the engine: plain TypeScript, no framework, no app code;
 * - a feature of the client (src/features/<f>) never imports another feature: shared pieces live in
 *   src/components, src/lib or shared/, and route pages (src/app) compose features.
 * `npm run lint` runs it with zero warnings allowed; .ci/run runs it before the tests.
 */
import { readdirSync } from 'node:fs';
import js from '@eslint/js';
import tseslint from 'typescript-eslint';
import reactHooks from 'eslint-plugin-react-hooks';
import importX from 'eslint-plugin-import-x';
import globals from 'globals';

const features = readdirSync(new URL('./src/features', import.meta.url), { withFileTypes: true })
  .filter((d) => d.isDirectory())
  .map((d) => d.name);

export default tseslint.config(
  { ignores: ['dist/**', 'node_modules/**', '.data/**', 'coverage/**', 'tests/e2e/screenshots/**', '.shots/**', 'fixtures/reference/**'] },
  js.configs.recommended,
  ...tseslint.configs.recommendedTypeChecked,
  {
    languageOptions: {
      parserOptions: { projectService: true, tsconfigRootDir: import.meta.dirname },
      globals: { ...globals.node, ...globals.browser },
    },
    linterOptions: { reportUnusedDisableDirectives: 'error' },
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_', caughtErrors: 'none', ignoreRestSiblings: true }],
      // Express's own types are extended by declaration merging into its global namespace.
      '@typescript-eslint/no-namespace': ['error', { allowDeclarations: true }],
      // It disagrees with tsc on contextual types (it called assertions unnecessary that tsc needs).
      '@typescript-eslint/no-unnecessary-type-assertion': 'off',
      // Express handlers and React event props take promise-returning functions by design.
      '@typescript-eslint/no-misused-promises': ['error', { checksVoidReturn: { arguments: false, attributes: false } }],
    },
  },
  {
    files: ['src/**/*.{ts,tsx}'],
    plugins: { 'react-hooks': reactHooks },
    // The rules of hooks; the React Compiler's extra checks are left out (the app does not use the compiler).
    rules: { 'react-hooks/rules-of-hooks': 'error', 'react-hooks/exhaustive-deps': 'error' },
  },
  {
    files: ['shared/thermal/**/*.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            { group: ['react', 'react-*', 'express', 'express-*', 'sequelize', 'mariadb', 'axios', 'zod', 'node:*'], message: 'The thermal engine is plain TypeScript: no framework, database or Node imports.' },
            { group: ['@/*', '#shared/*', '../schemas/*', '../../server/*', '../../src/*'], message: 'The thermal engine imports only its own modules (relative, inside shared/thermal).' },
          ],
        },
      ],
    },
  },
  {
    files: ['src/features/**/*.{ts,tsx}'],
    plugins: { 'import-x': importX },
    settings: { 'import-x/resolver': { typescript: false, node: true } },
    rules: {
      'no-restricted-imports': 'off',
    },
  },
  ...features.map((f) => ({
    files: [`src/features/${f}/**/*.{ts,tsx}`],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: features
            .filter((other) => other !== f)
            .map((other) => ({ group: [`@/features/${other}/*`, `../../${other}/*`, `../${other}/*`], message: `Features do not import each other: move what ${f} needs from ${other} to src/components, src/lib or shared/.` })),
        },
      ],
    },
  })),
  {
    // Tests read HTTP answers (supertest's `body` is `any`) and assert on them with expect; the
    // no-unsafe-* rules would only make them cast what expect already checks. They stay on for app code.
    files: ['tests/**/*.{ts,tsx}'],
    rules: {
      '@typescript-eslint/no-unsafe-member-access': 'off',
      '@typescript-eslint/no-unsafe-assignment': 'off',
      '@typescript-eslint/no-unsafe-call': 'off',
      '@typescript-eslint/no-unsafe-argument': 'off',
      '@typescript-eslint/no-unsafe-return': 'off',
      // Test doubles implement async interfaces with plain bodies, and pass on whatever a callback gave.
      '@typescript-eslint/require-await': 'off',
      '@typescript-eslint/prefer-promise-reject-errors': 'off',
      '@typescript-eslint/no-base-to-string': 'off',
    },
  },
  {
    files: ['**/*.{js,mjs,cjs}'],
    extends: [tseslint.configs.disableTypeChecked],
  },
);
