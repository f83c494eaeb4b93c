import { fileURLToPath, URL } from 'node:url';
import react from '@vitejs/plugin-react';
import { defineConfig } from 'vitest/config';

export default defineConfig({
  plugins: [react()],
  resolve: {
    alias: { '@': fileURLToPath(new URL('./src', import.meta.url)) },
  },
  build: {
    // React, the router and Chakra UI make an entry chunk of about 680 kB (195 kB gzip); pages load lazily.
    // The limit still catches a heavy library (Plotly is 4.6 MB) slipping into the entry.
    chunkSizeWarningLimit: 800,
  },
  server: {
    proxy: { '/api': 'http://127.0.0.1:3000' },
  },
  test: {
    environment: 'jsdom',
    globals: true,
    setupFiles: ['./test/setup.ts'],
    include: ['test/**/*.test.tsx', 'src/**/*.test.tsx'],
    css: false,
    testTimeout: 30_000,
  },
});
