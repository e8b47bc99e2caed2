// One type-aware ESLint config for every workspace; zero warnings allowed (`npm run lint`).
import fs from 'node:fs';
import path from 'node:path';
import js from '@eslint/js';
import importX from 'eslint-plugin-import-x';
import reactHooks from 'eslint-plugin-react-hooks';
import globals from 'globals';
import tseslint from 'typescript-eslint';

const FEATURES_DIR = 'apps/web/src/features';

/** How many folders deep a feature's files go (0: files right in the feature's folder). */
function depthBelow(dir) {
  const folders = fs.readdirSync(dir, { withFileTypes: true }).filter((e) => e.isDirectory());
  return folders.length === 0 ? 0 : 1 + Math.max(...folders.map((f) => depthBelow(path.join(dir, f.name))));
}

/**
 * One `no-restricted-imports` block per feature folder and per folder depth inside it: `@/features/…`
 * of another feature and `@/app/…` are refused, and so is a relative import climbing out of the
 * feature (at depth d, d + 1 or more `../`), which would reach another feature or bypass `@/`.
 */
function featureFences() {
  const root = path.join(import.meta.dirname, FEATURES_DIR);
  const features = fs
    .readdirSync(root, { withFileTypes: true })
    .filter((e) => e.isDirectory())
    .map((e) => e.name);
  return features.flatMap((feature) => {
    const deepest = depthBelow(path.join(root, feature));
    return Array.from({ length: deepest + 1 }, (_, depth) => ({
      files: [`${FEATURES_DIR}/${feature}/${'*/'.repeat(depth)}*.{ts,tsx}`],
      rules: {
        'no-restricted-imports': [
          'error',
          {
            patterns: [
              {
                regex: `^@/features/(?!${feature}(/|$))`,
                message: 'No cross-feature imports: compose features in src/app.',
              },
              { regex: '^@/app(/|$)', message: 'Features do not import from src/app.' },
              {
                regex: `^(\\./)*(\\.\\.(/|$)){${depth + 1},}`,
                message: `This relative import leaves the ${feature} feature: import lib and api with @/…, and no other feature.`,
              },
            ],
          },
        ],
      },
    }));
  });
}

export default tseslint.config(
  {
    ignores: [
      '**/node_modules/**',
      '**/dist/**',
      '.data/**',
      'apps/web/src/api/generated/**',
      'apps/web/test-results/**',
      'apps/web/playwright-report/**',
      '**/*.cjs',
    ],
  },
  js.configs.recommended,
  ...tseslint.configs.recommendedTypeChecked,
  {
    languageOptions: {
      parserOptions: { projectService: true, tsconfigRootDir: import.meta.dirname },
      globals: { ...globals.node },
    },
    plugins: { 'import-x': importX },
    rules: {
      '@typescript-eslint/no-floating-promises': 'error',
      '@typescript-eslint/switch-exhaustiveness-check': 'error',
      '@typescript-eslint/consistent-type-imports': ['error', { fixStyle: 'separate-type-imports' }],
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
      'import-x/order': [
        'error',
        {
          groups: ['builtin', 'external', 'internal', ['parent', 'sibling', 'index']],
          'newlines-between': 'never',
          alphabetize: { order: 'asc', caseInsensitive: true },
        },
      ],
    },
  },
  {
    files: ['**/*.mjs', '**/*.js'],
    ...tseslint.configs.disableTypeChecked,
  },
  {
    files: ['apps/web/**/*.{ts,tsx}', 'packages/ui/**/*.{ts,tsx}'],
    plugins: { 'react-hooks': reactHooks },
    languageOptions: { globals: { ...globals.browser } },
    rules: {
      ...reactHooks.configs.recommended.rules,
      'import-x/no-default-export': 'error',
    },
  },
  // Web features are self-contained: composed only in src/app, never importing one another, and
  // dependencies flow one way (app → features → lib/api). Built from the folders of src/features.
  ...featureFences(),
  {
    files: ['apps/web/src/lib/**/*.{ts,tsx}', 'apps/web/src/api/**/*.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            { regex: '^@/(app|features)/', message: 'lib and api do not depend on app or features.' },
          ],
        },
      ],
    },
  },
  {
    files: [
      'apps/web/vite.config.ts',
      'apps/web/playwright.config.ts',
      'apps/web/playwright.bench.config.ts',
      'apps/web/e2e/**',
    ],
    rules: { 'import-x/no-default-export': 'off' },
  },
  {
    files: ['**/*.spec.ts', '**/*.test.ts', '**/*.test.tsx', '**/*.e2e-spec.ts', '**/test/**', '**/e2e/**'],
    rules: {
      '@typescript-eslint/no-unsafe-assignment': 'off',
      '@typescript-eslint/no-unsafe-member-access': 'off',
      '@typescript-eslint/no-unsafe-argument': 'off',
      '@typescript-eslint/no-unsafe-return': 'off',
      '@typescript-eslint/no-unsafe-call': 'off',
      '@typescript-eslint/no-explicit-any': 'off',
      '@typescript-eslint/unbound-method': 'off',
    },
  },
);
