// Flat config after the Vite react-ts starter, plus Prettier, a ban on `any` and the
// import boundaries: app → features → shared (components, lib, config).
import js from '@eslint/js';
import prettier from 'eslint-config-prettier';
import reactHooks from 'eslint-plugin-react-hooks';
import reactRefresh from 'eslint-plugin-react-refresh';
import { defineConfig, globalIgnores } from 'eslint/config';
import globals from 'globals';
import tseslint from 'typescript-eslint';

const features = ['auth', 'staff', 'clients', 'consent', 'samples', 'audit'];

const leaveFeatureRelatively = {
  regex: '^\\.\\./\\.\\./',
  message: 'Import across folders with the @/ alias.',
};
const importApp = {
  regex: '^@/app(/|$)',
  message: 'Only src/app composes pages; features and shared code must not import it.',
};

// A feature may import shared code but not another feature (compose features in src/app).
const featureBoundaries = features.map((feature) => ({
  files: [`src/features/${feature}/**/*.{ts,tsx}`],
  rules: {
    'no-restricted-imports': [
      'error',
      {
        patterns: [
          importApp,
          leaveFeatureRelatively,
          ...features
            .filter((other) => other !== feature)
            .map((other) => ({
              regex: `^@/features/${other}(/|$)`,
              message: `Features stay independent: compose ${other} and ${feature} in src/app.`,
            })),
        ],
      },
    ],
  },
}));

export default defineConfig([
  globalIgnores(['dist', 'coverage']),
  {
    files: ['**/*.{ts,tsx}'],
    extends: [
      js.configs.recommended,
      tseslint.configs.recommended,
      reactHooks.configs.flat.recommended,
      reactRefresh.configs.vite,
    ],
    languageOptions: {
      ecmaVersion: 2022,
      globals: globals.browser,
    },
    rules: {
      '@typescript-eslint/no-explicit-any': 'error',
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_' }],
      '@typescript-eslint/consistent-type-definitions': ['error', 'type'],
      'no-restricted-globals': [
        'error',
        { name: 'process', message: 'Read settings from src/config/env.ts.' },
      ],
      'no-restricted-syntax': [
        'error',
        { selector: 'ExportDefaultDeclaration', message: 'Use named exports.' },
        {
          selector: "JSXAttribute[name.name='tabIndex'][value.expression.value>0]",
          message: 'No positive tabIndex: keep the DOM order the tab order.',
        },
      ],
    },
  },
  {
    files: ['src/components/**/*.{ts,tsx}', 'src/lib/**/*.ts', 'src/config/**/*.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            importApp,
            { regex: '^@/features(/|$)', message: 'Shared code must not depend on a feature.' },
          ],
        },
      ],
    },
  },
  ...featureBoundaries,
  {
    // Tooling configs are default-exported by convention and run in Node.
    files: ['vite.config.ts', 'eslint.config.js', 'postcss.config.mjs'],
    languageOptions: { globals: globals.node },
    rules: { 'no-restricted-syntax': 'off', 'no-restricted-globals': 'off' },
  },
  {
    files: ['src/testing/**/*.{ts,tsx}', 'src/**/*.test.{ts,tsx}'],
    rules: { 'react-refresh/only-export-components': 'off' },
  },
  prettier,
]);
