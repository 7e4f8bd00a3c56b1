import { fileURLToPath } from 'node:url';
import tailwindcss from '@tailwindcss/vite';
import react from '@vitejs/plugin-react';
import { defineConfig } from 'vite';

const webRoot = fileURLToPath(new URL('./packages/web', import.meta.url));

// The web site is built into packages/web/dist, which the server serves beside the API.
export default defineConfig({
  root: webRoot,
  plugins: [react(), tailwindcss()],
  build: { outDir: 'dist', emptyOutDir: true, sourcemap: true },
  server: {
    host: '127.0.0.1',
    proxy: { '/api': `http://127.0.0.1:${process.env.PORT ?? '8080'}` },
  },
  preview: { host: '127.0.0.1' },
});
