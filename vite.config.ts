/// <reference types="vitest/config" />
import { defineConfig } from 'vite';

// One config for the page (vite), the unit tests and the benchmarks (vitest).
// Lit components declare reactive properties with `static properties`, not decorators:
// Vite 8 transforms TypeScript with Oxc, which leaves standard decorators untranspiled.
export default defineConfig({
  build: {
    target: 'es2022',
    sourcemap: true,
    chunkSizeWarningLimit: 1500,
  },
  worker: {
    format: 'es',
  },
  test: {
    include: ['test/**/*.test.ts'],
    exclude: ['test/e2e/**', 'node_modules/**'],
    environment: 'node',
    globalSetup: ['test/setup/build-cli.ts'],
    setupFiles: ['test/setup/builtins.ts'],
    testTimeout: 30_000,
    benchmark: {
      include: ['test/bench/**/*.bench.ts'],
    },
  },
});
