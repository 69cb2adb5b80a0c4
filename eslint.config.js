// ESLint flat config for the whole repository (TypeScript + Vue single-file components).
import js from '@eslint/js';
import tseslint from 'typescript-eslint';
import pluginVue from 'eslint-plugin-vue';
import prettierConfig from 'eslint-config-prettier/flat';

export default tseslint.config(
  { ignores: ['**/dist/**', '**/node_modules/**', '.data/**', 'tests/e2e/screenshots/**'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  ...pluginVue.configs['flat/recommended'],
  {
    files: ['**/*.vue'],
    languageOptions: { parserOptions: { parser: tseslint.parser } },
  },
  {
    // Plain Node scripts (no globals package in the tree: the few names they use).
    files: ['**/*.mjs', '**/*.js'],
    languageOptions: {
      globals: Object.fromEntries(
        ['process', 'console', 'fetch', 'setTimeout', 'clearTimeout', 'Buffer', 'URL'].map((n) => [
          n,
          'readonly',
        ]),
      ),
    },
  },
  {
    // TypeScript checks names itself; ESLint's no-undef knows neither DOM nor Node types.
    files: ['**/*.ts', '**/*.vue'],
    rules: { 'no-undef': 'off' },
  },
  {
    rules: {
      '@typescript-eslint/no-explicit-any': 'error',
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_' }],
      'vue/multi-word-component-names': 'off',
      'vue/max-attributes-per-line': 'off',
      'vue/singleline-html-element-content-newline': 'off',
      'vue/html-self-closing': 'off',
    },
  },
  // Prettier owns formatting (checked by `npm test`): ESLint's stylistic rules are off.
  prettierConfig,
);
