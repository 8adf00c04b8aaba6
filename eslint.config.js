import pluginVue from 'eslint-plugin-vue'
import { defineConfigWithVueTs, vueTsConfigs } from '@vue/eslint-config-typescript'
import globals from 'globals'

export default defineConfigWithVueTs(
  {
    name: 'app/files-to-lint',
    files: ['**/*.{ts,mts,tsx,vue,js}'],
  },
  {
    name: 'app/files-to-ignore',
    ignores: [
      '**/dist/**',
      'dist-server/**',
      '**/coverage/**',
      '.data/**',
      'uploads/**',
      'tests/fixtures/**',
    ],
  },
  pluginVue.configs['flat/essential'],
  vueTsConfigs.recommended,
  {
    name: 'app/node-globals',
    files: ['server/**', 'scripts/**', 'tests/**', 'migrations/**', 'seeds/**', '*.config.*'],
    languageOptions: { globals: globals.node },
  },
  {
    name: 'app/rules',
    rules: {
      '@typescript-eslint/no-unused-vars': [
        'error',
        { argsIgnorePattern: '^_', varsIgnorePattern: '^_' },
      ],
      'no-console': ['error', { allow: ['warn', 'error'] }],
    },
  },
  {
    name: 'app/console-allowed',
    files: [
      'scripts/**',
      'server/cli/**',
      'server/index.ts',
      'server/db/local-mariadb.ts',
      'server/db/migrate-cli.ts',
      'seeds/**',
      'tests/bench/**',
    ],
    rules: { 'no-console': 'off' },
  },
)
