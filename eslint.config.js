// Expo's flat config for the whole repo, plus the few rules we hold ourselves to.
const { defineConfig } = require('eslint/config');
const expoConfig = require('eslint-config-expo/flat');
const globals = require('globals');

module.exports = defineConfig([
  expoConfig,
  {
    ignores: ['dist/**', 'node_modules/**', '.expo/**', '.data/**', 'tests/artifacts/**', 'expo-env.d.ts'],
  },
  {
    files: ['server/dev/bootstrap.js', '*.config.js'],
    languageOptions: { sourceType: 'commonjs', globals: globals.node },
  },
  {
    files: ['**/*.ts', '**/*.tsx'],
    rules: {
      '@typescript-eslint/no-non-null-assertion': 'error',
    },
  },
]);
