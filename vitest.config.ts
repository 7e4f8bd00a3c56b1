import react from '@vitejs/plugin-react';
import { defineConfig } from 'vitest/config';

// One project per package plus the cross-package tests; `npm test` runs them all against the
// PostgreSQL it starts (DATABASE_URL) and the web site it builds.
export default defineConfig({
  test: {
    projects: [
      { test: { name: 'core', root: './packages/core', include: ['src/**/*.test.ts'] } },
      { test: { name: 'cli', root: './packages/cli', include: ['src/**/*.test.ts'], testTimeout: 30_000 } },
      { test: { name: 'server', root: './packages/server', include: ['src/**/*.test.ts'], testTimeout: 30_000 } },
      {
        plugins: [react()],
        test: {
          name: 'web',
          root: './packages/web',
          environment: 'jsdom',
          include: ['src/**/*.test.ts', 'src/**/*.test.tsx'],
        },
      },
      {
        test: {
          name: 'integration',
          root: '.',
          include: ['tests/**/*.test.ts'],
          testTimeout: 60_000,
          hookTimeout: 60_000,
        },
      },
    ],
  },
});
