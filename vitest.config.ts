import { fileURLToPath, URL } from 'node:url'
import { defineConfig } from 'vitest/config'
import vue from '@vitejs/plugin-vue'

// Three projects: unit (beside the code), integration (HTTP + real MariaDB) and
// e2e (built app in Debian's Chromium). scripts/test.sh sets up what the latter two need.
// Unit tests may import .vue files (rendered to HTML with vue/server-renderer, no DOM).
const alias = {
  '@': fileURLToPath(new URL('./src', import.meta.url)),
  '@shared': fileURLToPath(new URL('./shared', import.meta.url)),
}

export default defineConfig({
  resolve: { alias },
  test: {
    projects: [
      {
        plugins: [vue()],
        resolve: { alias },
        test: {
          name: 'unit',
          environment: 'node',
          // Vant's style entries import .css, which Node cannot load: let Vite read Vant.
          server: { deps: { inline: ['vant'] } },
          include: ['shared/**/__tests__/**/*.test.ts', 'server/**/__tests__/**/*.test.ts', 'src/**/__tests__/**/*.test.ts', 'scripts/**/__tests__/**/*.test.ts'],
          testTimeout: 30_000,
        },
      },
      {
        resolve: { alias },
        test: {
          name: 'integration',
          environment: 'node',
          include: ['tests/integration/**/*.test.ts'],
          testTimeout: 60_000,
          hookTimeout: 120_000,
        },
      },
      {
        resolve: { alias },
        test: {
          name: 'e2e',
          environment: 'node',
          include: ['tests/e2e/**/*.test.ts'],
          globalSetup: ['tests/e2e/global-setup.ts'],
          fileParallelism: false,
          testTimeout: 120_000,
          hookTimeout: 180_000,
        },
      },
    ],
  },
})
