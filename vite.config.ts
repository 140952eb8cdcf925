import { defineConfig } from 'vite';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';
import { VitePWA } from 'vite-plugin-pwa';

export default defineConfig({
  plugins: [
    react(),
    tailwindcss(),
    // The installable app: manifest and a Workbox service worker (src/sw.ts) precaching the shell, every screen and the
    // fonts. It registers from src/lib/app-updates.ts (prompt style), so injectRegister is off.
    VitePWA({
      strategies: 'injectManifest',
      srcDir: 'src',
      filename: 'sw.ts',
      injectRegister: false,
      registerType: 'prompt',
      includeAssets: ['nestkeeper.svg', 'icons/apple-touch-icon.png'],
      manifest: {
        id: '/',
        name: 'Nestkeeper',
        short_name: 'Nestkeeper',
        description: 'Kit, field checks and damage reports for portable metrology — also without signal.',
        start_url: '/',
        scope: '/',
        display: 'standalone',
        orientation: 'portrait',
        background_color: '#f6f1e7',
        theme_color: '#1c2536',
        icons: [
          { src: '/icons/nestkeeper-192.png', sizes: '192x192', type: 'image/png' },
          { src: '/icons/nestkeeper-512.png', sizes: '512x512', type: 'image/png' },
          { src: '/icons/nestkeeper-512.png', sizes: '512x512', type: 'image/png', purpose: 'maskable' },
          { src: '/icons/nestkeeper-app.svg', sizes: 'any', type: 'image/svg+xml' },
        ],
      },
      injectManifest: {
        // The shell, its lazy screens, styles, the bundled Latin fonts and the icons; never an /api answer.
        globPatterns: ['**/*.{js,css,html,svg,png,webmanifest}', '**/*-latin-{400,600,700}-normal-*.woff2', '**/*-latin-*.woff2'],
        maximumFileSizeToCacheInBytes: 4 * 1024 * 1024,
      },
      devOptions: { enabled: false },
    }),
  ],
  server: {
    host: '127.0.0.1',
    port: 5173,
    proxy: { '/api': `http://127.0.0.1:${process.env.API_PORT ?? 4600}` },
  },
  build: { outDir: 'dist/client', sourcemap: false, chunkSizeWarningLimit: 1200 },
});
