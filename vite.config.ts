import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vite';
import vue from '@vitejs/plugin-vue';
import Components from 'unplugin-vue-components/vite';
import { ElementPlusResolver } from 'unplugin-vue-components/resolvers';

const here = (path: string) => fileURLToPath(new URL(path, import.meta.url));
// `npm run dev` passes the API's address; plain `vite` assumes the default port.
const API = process.env.API_URL ?? 'http://127.0.0.1:3000';

export default defineConfig({
  root: here('./web'),
  plugins: [
    vue(),
    // Element Plus on demand: only the components a template uses, each with its own CSS.
    Components({
      dirs: [],
      resolvers: [ElementPlusResolver({ importStyle: 'css' })],
      dts: here('./web/src/components.d.ts'),
    }),
  ],
  resolve: {
    alias: {
      '@': here('./web/src'),
      '@shared': here('./shared/src'),
    },
  },
  define: {
    // vue-i18n in composition mode only; drops the legacy API from the bundle.
    __VUE_I18N_FULL_INSTALL__: true,
    __VUE_I18N_LEGACY_API__: false,
    __INTLIFY_PROD_DEVTOOLS__: false,
  },
  build: {
    outDir: here('./dist/web'),
    emptyOutDir: true,
    manifest: true,
    // Every asset is a file, so the page needs nothing beyond 'self' in the server's CSP.
    assetsInlineLimit: 0,
  },
  server: {
    host: '127.0.0.1',
    proxy: {
      '/api': { target: API, changeOrigin: false },
      '/socket.io': { target: API, ws: true, changeOrigin: false },
    },
  },
  preview: { host: '127.0.0.1' },
});
