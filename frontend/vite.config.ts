import { fileURLToPath, URL } from 'node:url';
import react from '@vitejs/plugin-react';
import { defineConfig } from 'vitest/config';

export default defineConfig({
  plugins: [react()],
  resolve: {
    alias: { '@': fileURLToPath(new URL('./src', import.meta.url)) },
  },
  build: {
    // React, the router and Chakra UI make an entry chunk of about 600-700 kB (160-200 kB gzip); pages load lazily.
    // Plotly's own lazy chunk (4.6 MB) is expected to exceed the limit; any other chunk that does needs a look.
    chunkSizeWarningLimit: 800,
  },
  server: {
    proxy: { '/api': 'http://127.0.0.1:3000' },
  },
  test: {
    environment: 'jsdom',
    globals: true,
    setupFiles: ['./test/setup.ts'],
    include: ['test/**/*.test.{ts,tsx}', 'src/**/*.test.{ts,tsx}'],
    css: false,
    testTimeout: 30_000,
  },
});
