import { fileURLToPath, URL } from 'node:url'
import { defineConfig } from 'vite'
import vue from '@vitejs/plugin-vue'
import Components from 'unplugin-vue-components/vite'
import { VantResolver } from '@vant/auto-import-resolver'
import { VitePWA } from 'vite-plugin-pwa'
import { dropRemoteFonts } from './scripts/vite/dropRemoteFonts.ts'

// The PWA client. The API is served by the Express server on the same origin;
// in `vite dev` requests to /api are proxied to it.
export default defineConfig({
  plugins: [
    // Vant's icon font falls back to a CDN our Content-Security-Policy blocks; keep the embedded one.
    dropRemoteFonts(),
    vue(),
    Components({ resolvers: [VantResolver()], dts: 'src/components.d.ts' }),
    VitePWA({
      registerType: 'prompt',
      injectRegister: false,
      includeAssets: ['favicon.svg', 'icons/*.png'],
      manifest: {
        name: 'Sharpfield',
        short_name: 'Sharpfield',
        description: 'Focus checks for fixed cameras, on site and offline',
        theme_color: '#0f3d3e',
        background_color: '#f4f7f6',
        display: 'standalone',
        start_url: '/',
        scope: '/',
        icons: [
          { src: '/icons/icon-192.png', sizes: '192x192', type: 'image/png' },
          { src: '/icons/icon-512.png', sizes: '512x512', type: 'image/png' },
          { src: '/icons/icon-maskable-512.png', sizes: '512x512', type: 'image/png', purpose: 'maskable' },
        ],
      },
      workbox: {
        globPatterns: ['**/*.{js,css,html,svg,png,woff2,webmanifest}'],
        navigateFallback: '/index.html',
        navigateFallbackDenylist: [/^\/api\//],
        maximumFileSizeToCacheInBytes: 5 * 1024 * 1024,
        // Background Sync wake-up for the outbox (the push runs in the page; see the file).
        importScripts: ['/sw-sync.js'],
      },
    }),
  ],
  resolve: {
    alias: {
      '@': fileURLToPath(new URL('./src', import.meta.url)),
      '@shared': fileURLToPath(new URL('./shared', import.meta.url)),
    },
  },
  worker: { format: 'es' },
  server: {
    proxy: { '/api': `http://127.0.0.1:${process.env.PORT ?? 8080}` },
  },
  build: {
    chunkSizeWarningLimit: 1500,
  },
})
