import { defineConfig } from 'vitest/config';
import { fileURLToPath } from 'node:url';

const alias = {
  '@shared': fileURLToPath(new URL('./shared', import.meta.url)),
  '@': fileURLToPath(new URL('./src', import.meta.url)),
};

// Three projects: pure unit tests run in parallel; API and browser tests share one
// PostgreSQL test database, so their files run one at a time, and the browser group starts only
// after the unit and API group has finished (sequence.groupOrder).
export default defineConfig({
  resolve: { alias },
  test: {
    globalSetup: ['tests/global-setup.ts'],
    projects: [
      {
        extends: true,
        test: {
          name: 'unit',
          include: ['shared/**/*.test.ts', 'server/**/*.test.ts', 'src/**/*.test.{ts,tsx}', 'data/**/*.test.ts', 'scripts/**/*.test.ts', 'tests/lint/**/*.test.ts'],
          environment: 'node',
        },
      },
      {
        extends: true,
        test: {
          name: 'api',
          include: ['tests/api/**/*.test.ts'],
          fileParallelism: false,
          testTimeout: 30_000,
          hookTimeout: 60_000,
          setupFiles: ['tests/setup-env.ts'],
        },
      },
      {
        extends: true,
        test: {
          name: 'e2e',
          include: ['tests/e2e/**/*.test.ts'],
          fileParallelism: false,
          sequence: { groupOrder: 1 },
          testTimeout: 60_000,
          hookTimeout: 120_000,
          setupFiles: ['tests/setup-env.ts'],
        },
      },
    ],
  },
});
