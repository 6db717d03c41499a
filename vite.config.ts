import { defineConfig } from 'vite';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';

// changeOrigin stays false so the Host header (and with it the OIDC callback URL) keeps the dev port.
const apiServer = { target: 'http://127.0.0.1:3000', changeOrigin: false };

export default defineConfig({
  plugins: [react(), tailwindcss()],
  server: {
    host: '127.0.0.1',
    port: 5173,
    strictPort: true,
    proxy: { '/api': apiServer, '/auth': apiServer },
  },
  build: {
    outDir: 'dist',
    emptyOutDir: true,
    rollupOptions: {
      output: {
        manualChunks(id) {
          if (/node_modules[\\/](echarts|zrender|echarts-for-react)[\\/]/.test(id)) return 'echarts';
          return undefined;
        },
      },
    },
  },
});
