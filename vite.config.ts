import { fileURLToPath } from 'node:url';
import tailwindcss from '@tailwindcss/vite';
import react from '@vitejs/plugin-react';
import { defineConfig } from 'vite';
import { compression } from 'vite-plugin-compression2';

// The Restday server serves `dist/` and the API under `/api`; in dev, Vite serves the SPA and
// forwards `/api` to that server.
/**
 * The client runs on Preact through its React compatibility layer: the same components and
 * libraries, a fifth of react-dom's weight on a first visit (decision 0076). Component tests use
 * the same aliases, so they test what ships.
 */
export const reactOnPreact = {
  'react-dom/test-utils': 'preact/test-utils',
  'react-dom/client': 'preact/compat/client',
  'react-dom': 'preact/compat',
  'react/jsx-runtime': 'preact/jsx-runtime',
  'react/jsx-dev-runtime': 'preact/jsx-dev-runtime',
  react: 'preact/compat',
};

const apiPort = process.env.RESTDAY_API_PORT ?? '3000';

export default defineConfig({
  // Brotli and gzip copies made once at build time; the server sends whichever the browser accepts.
  plugins: [react(), tailwindcss(), { ...compression({ algorithms: ['brotliCompress', 'gzip'] }), apply: (_config, env) => !env.isSsrBuild }],
  resolve: {
    alias: {
      '@shared': fileURLToPath(new URL('./shared', import.meta.url)),
      '@': fileURLToPath(new URL('./src', import.meta.url)),
      ...reactOnPreact,
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
    rolldownOptions: {
      // React Router reads React 19's useOptimistic only where it exists; Preact has none, by design.
      onwarn(warning, warn) {
        if (warning.code === 'IMPORT_IS_UNDEFINED' && warning.message.includes('useOptimistic')) return;
        warn(warning);
      },
    },
  },
  // The server render (src/entry-server.tsx) bundles its libraries, so they get the aliases too.
  ssr: { noExternal: true },
});
