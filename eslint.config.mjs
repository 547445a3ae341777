// Expo's recommended rules (React, hooks, imports, TypeScript) for the whole project.
import expoConfig from 'eslint-config-expo/flat.js';
import { defineConfig } from 'eslint/config';

export default defineConfig([
  expoConfig,
  {
    ignores: ['dist/**', '.data*/**', 'node_modules/**', '.expo/**', 'test-results/**', 'playwright-report/**', 'db/migrations/**'],
  },
  {
    files: ['**/*.cjs'],
    languageOptions: { sourceType: 'commonjs', globals: { __dirname: 'readonly', require: 'readonly', module: 'writable' } },
  },
]);
