import { fileURLToPath } from 'node:url';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';
import { defineConfig } from 'vite';

const fromRoot = (path: string) => fileURLToPath(new URL(path, import.meta.url));

export const aliases = {
  '@client': fromRoot('./client'),
  '@shared': fromRoot('./shared'),
  '@sandbox': fromRoot('./sandbox'),
  '@server': fromRoot('./server'),
  '@tests': fromRoot('./tests'),
};

const apiPort = process.env.PORT ?? '3000';

export default defineConfig({
  root: fromRoot('./client'),
  plugins: [react(), tailwindcss()],
  resolve: { alias: aliases },
  build: {
    outDir: fromRoot('./dist/client'),
    emptyOutDir: true,
  },
  server: {
    host: '127.0.0.1',
    port: 5173,
    strictPort: true,
    proxy: {
      '/api': `http://127.0.0.1:${apiPort}`,
      '/auth': `http://127.0.0.1:${apiPort}`,
    },
  },
});
