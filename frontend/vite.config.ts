import { defineConfig } from 'vite'
import vue from '@vitejs/plugin-vue'
import { fileURLToPath } from 'node:url'

const root = fileURLToPath(new URL('.', import.meta.url))
const apiTarget = `http://127.0.0.1:${process.env.PORT ?? 3000}`

// The API serves the built app from frontend/dist; in development Vite proxies /api to it so
// cookies and the CSRF token stay same-origin.
export default defineConfig({
  root,
  plugins: [vue()],
  build: {
    outDir: 'dist',
    emptyOutDir: true,
  },
  server: {
    host: '127.0.0.1',
    port: 5173,
    strictPort: true,
    proxy: {
      '/api': { target: apiTarget, changeOrigin: false },
    },
  },
  preview: {
    host: '127.0.0.1',
    port: 4173,
  },
})
