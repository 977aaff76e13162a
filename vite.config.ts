import { fileURLToPath } from 'node:url';
import tailwindcss from '@tailwindcss/vite';
import react from '@vitejs/plugin-react';
import { defineConfig } from 'vite';
import { compression } from 'vite-plugin-compression2';

// The Restday server serves `dist/` and the API under `/api`; in dev, Vite serves the SPA and
// forwards `/api` to that server.
const apiPort = process.env.RESTDAY_API_PORT ?? '3000';

export default defineConfig({
  // Brotli and gzip copies made once at build time; the server sends whichever the browser accepts.
  plugins: [react(), tailwindcss(), compression({ algorithms: ['brotliCompress', 'gzip'] })],
  resolve: {
    alias: {
      '@shared': fileURLToPath(new URL('./shared', import.meta.url)),
      '@': fileURLToPath(new URL('./src', import.meta.url)),
    },
  },
  server: {
    host: '127.0.0.1',
    proxy: {
      '/api': { target: `http://127.0.0.1:${apiPort}`, changeOrigin: false },
    },
  },
  build: {
    outDir: 'dist',
    emptyOutDir: true,
  },
});
