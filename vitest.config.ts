import { defineConfig } from 'vitest/config';
import { aliases } from './vite.config.ts';

export default defineConfig({
  resolve: { alias: aliases },
  test: {
    environment: 'node',
    include: ['tests/**/*.test.ts'],
    pool: 'forks',
    // isolated-vm needs the first flag on Node 20; the second keeps V8 from leaving code in an
    // isolate unoptimised, which would distort timing (see DEVELOPERS.md).
    execArgv: ['--no-node-snapshot', '--no-concurrent-recompilation'],
    globalSetup: ['./tests/helpers/global-setup.ts'],
    testTimeout: 30_000,
    hookTimeout: 60_000,
  },
});
