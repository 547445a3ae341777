// Expo's recommended rules (React, hooks, imports, TypeScript), typescript-eslint's type-checked
// recommended rules and sorted imports for the whole project.
import { defineConfig } from 'eslint/config';
import expoConfig from 'eslint-config-expo/flat.js';
import simpleImportSort from 'eslint-plugin-simple-import-sort';
import { configs as typescriptEslint } from 'typescript-eslint';

export default defineConfig([
  expoConfig,
  {
    ignores: ['dist/**', '.data*/**', 'node_modules/**', '.expo/**', 'test-results/**', 'playwright-report/**', 'db/migrations/**'],
  },
  typescriptEslint.recommendedTypeChecked,
  {
    languageOptions: {
      // Type information for every linted file comes from tsconfig.json, which also lists the
      // plain-JS files (this config, Metro's, the worker-thread entries) through allowJs.
      parserOptions: { projectService: true, tsconfigRootDir: import.meta.dirname },
    },
  },
  {
    plugins: { 'simple-import-sort': simpleImportSort },
    rules: {
      'simple-import-sort/imports': 'error',
      'simple-import-sort/exports': 'error',
    },
  },
]);
