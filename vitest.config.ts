/**
 * Test projects for everything outside the Angular app (the app's own specs run
 * through `ng test`). The orchestrator in server/ops/test-all.ts runs them in order
 * and sums the counts.
 */
import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    projects: [
      { test: { name: 'shared', include: ['shared/**/*.spec.ts'], environment: 'node' } },
      { test: { name: 'server', include: ['server/**/*.spec.ts'], environment: 'node' } },
      { test: { name: 'reference', include: ['test/reference/**/*.test.ts'], environment: 'node', testTimeout: 60_000 } },
      { test: { name: 'cli', include: ['test/cli/**/*.test.ts'], environment: 'node', testTimeout: 120_000 } },
      { test: { name: 'api', include: ['test/api/**/*.test.ts'], environment: 'node', testTimeout: 60_000, hookTimeout: 120_000, fileParallelism: false } },
      { test: { name: 'browser', include: ['test/browser/**/*.test.ts'], environment: 'node', testTimeout: 120_000, hookTimeout: 180_000, fileParallelism: false } },
    ],
  },
});
