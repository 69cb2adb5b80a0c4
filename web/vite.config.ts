import { fileURLToPath, URL } from 'node:url';
import { constants as zlibConstants } from 'node:zlib';
import { defineConfig, defaultClientConditions } from 'vite';
import vue from '@vitejs/plugin-vue';
import Components from 'unplugin-vue-components/vite';
import { compression, defineAlgorithm } from 'vite-plugin-compression2';
import { AntDesignVueResolver } from 'unplugin-vue-components/resolvers';

const apiPort = process.env.API_PORT ?? '8080';

export default defineConfig({
  plugins: [
    vue(),
    // On-demand ant-design-vue components. importStyle: false because antd 4 styles are
    // CSS-in-JS; importing its CSS files breaks the build.
    Components({
      resolvers: [AntDesignVueResolver({ importStyle: false })],
      dirs: [],
      dts: 'components.d.ts',
    }),
    // Every text file of the build also written as .br and .gz at the strongest settings, once
    // at build time; the API serves the one the browser accepts (api/src/middlewares/not-found.ts).
    compression({
      algorithms: [
        defineAlgorithm('brotliCompress', { params: { [zlibConstants.BROTLI_PARAM_QUALITY]: 11 } }),
        defineAlgorithm('gzip', { level: 9 }),
      ],
      include: /\.(html|js|mjs|css|svg|json|txt|map)$/,
      exclude: /(^|\/)\.vite\//,
      threshold: 1024,
      logLevel: 'silent',
    }),
  ],
  resolve: {
    conditions: ['@basinwright/source', ...defaultClientConditions],
    alias: { '@': fileURLToPath(new URL('./src', import.meta.url)) },
  },
  server: {
    host: '127.0.0.1',
    proxy: { '/api': { target: `http://127.0.0.1:${apiPort}`, changeOrigin: false } },
  },
  preview: { host: '127.0.0.1' },
  // The study worker (src/workers/study.worker.ts) is a module worker: built as ES modules.
  worker: { format: 'es' },
  build: {
    outDir: 'dist',
    // dist/.vite/manifest.json: which chunks each view loads (the bundle test and `npm run bench`
    // read it; the server never serves a dot-folder).
    manifest: true,
    emptyOutDir: true,
    rolldownOptions: {
      // common/src is pure (no work at import time except building its private mathjs
      // instance), so modules whose exports go unused may be dropped: the sign-in page must
      // not carry the units engine.
      treeshake: {
        moduleSideEffects: (id: string) => !id.replaceAll('\\', '/').includes('/common/src/'),
      },
    },
  },
});
