import { defineConfig } from 'vitest/config';
import react from '@vitejs/plugin-react';

export default defineConfig({
  plugins: [react()],
  worker: { format: 'es' },
  build: { target: 'es2022', chunkSizeWarningLimit: 2000 },
  test: {
    include: ['test/**/*.test.ts'],
    environment: 'node',
    // Generous: the reference runs (NIST fits, property tests) take under a second on a quiet machine,
    // but CI machines can be several times slower; speed is measured by the benchmark, not here.
    testTimeout: 30_000,
  },
});
