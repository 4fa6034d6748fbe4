import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';

const root = fileURLToPath(new URL('..', import.meta.url));

export default defineConfig({
  root,
  resolve: { alias: { '@/': root } },
  test: {
    include: ['features/**/*.test.ts', 'server/**/*.test.ts', 'db/**/*.test.ts', 'test/api/**/*.test.ts', 'test/bench/**/*.test.ts'],
    environment: 'node',
    globalSetup: ['test/api/global-setup.ts'],
    testTimeout: 20_000,
    hookTimeout: 60_000,
  },
});
