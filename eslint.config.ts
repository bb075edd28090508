import pluginVue from 'eslint-plugin-vue'
import { defineConfigWithVueTs, vueTsConfigs } from '@vue/eslint-config-typescript'


export default defineConfigWithVueTs(
  {
    name: 'sharpfield/ignores',
    ignores: ['dist/**', 'node_modules/**', 'drizzle/**', '.data/**', '.test-data/**', 'test-results/**', 'coverage/**', 'src/components.d.ts', 'bench/results/**'],
  },
  pluginVue.configs['flat/essential'],
  vueTsConfigs.recommended,
  {
    name: 'sharpfield/rules',
    rules: {
      '@typescript-eslint/consistent-type-imports': 'error',
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
      'vue/multi-word-component-names': 'off',
    },
  },
  {
    name: 'sharpfield/shared-is-pure',
    files: ['shared/**/*.ts'],
    ignores: ['shared/**/__tests__/**'],
    rules: {
      'no-restricted-globals': [
        'error',
        ...['window', 'document', 'navigator', 'self', 'localStorage', 'sessionStorage', 'indexedDB', 'fetch', 'XMLHttpRequest', 'process', 'Buffer', 'require', '__dirname', '__filename', 'global', 'setImmediate', 'module'].map((name) => ({ name, message: 'shared/ runs in browser, worker and Node alike: no DOM or Node globals.' })),
      ],
      'no-restricted-imports': ['error', { patterns: ['node:*', '../../src/*', '../../server/*', '@/*'] }],
    },
  },
  {
    name: 'sharpfield/tests',
    files: ['**/__tests__/**', 'tests/**'],
    rules: {
      'no-restricted-syntax': [
        'error',
        { selector: "CallExpression[callee.object.name=/^(it|test|describe)$/][callee.property.name='only']", message: 'No focused tests.' },
        { selector: "CallExpression[callee.object.name=/^(it|test|describe)$/][callee.property.name='skip']", message: 'No skipped tests.' },
      ],
    },
  },
)
