import { execFileSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { fileURLToPath, URL } from 'node:url';
import { constants as zlibConstants } from 'node:zlib';
import { defineConfig, defaultClientConditions, type Plugin } from 'vite';
import vue from '@vitejs/plugin-vue';
import Components from 'unplugin-vue-components/vite';
import { compression, defineAlgorithm } from 'vite-plugin-compression2';
import { AntDesignVueResolver } from 'unplugin-vue-components/resolvers';

const apiPort = process.env.API_PORT ?? '8080';

/**
 * The ant-design-vue components' styles, worked out at build time (build/antd-static-style.ts)
 * and linked from index.html ahead of the app's own CSS, where antd would inject them at run
 * time. The first file carries the map by which antd knows to skip that work in the browser.
 */
function antdStaticStyle(): Plugin {
  let files: string[] = [];
  return {
    name: 'basinwright:antd-static-style',
    apply: 'build',
    buildStart() {
      const script = fileURLToPath(new URL('./build/antd-static-style.ts', import.meta.url));
      // In a child process: antd fixes its class-name hash from NODE_ENV when first loaded.
      const out = execFileSync(process.execPath, ['--import', 'tsx', script], {
        env: { ...process.env, NODE_ENV: 'production' },
        encoding: 'utf8',
        maxBuffer: 64 * 1024 * 1024,
      });
      files = (JSON.parse(out) as string[]).map((source, i) => {
        const hash = createHash('sha256').update(source).digest('base64url').slice(0, 8);
        const fileName = `assets/antd-${i + 1}-${hash}.css`;
        this.emitFile({ type: 'asset', fileName, source });
        return fileName;
      });
    },
    transformIndexHtml: {
      order: 'post',
      handler: () =>
        files.map((f) => ({
          tag: 'link',
          attrs: { rel: 'stylesheet', href: `/${f}` },
          injectTo: 'head-prepend' as const,
        })),
    },
  };
}

export default defineConfig({
  plugins: [
    vue(),
    antdStaticStyle(),
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
    // One stylesheet for the whole app, linked from index.html (about 70 kB before compression).
    // Split per view, each lazily loaded view's CSS was a <link> appended as the view loaded,
    // inside the main thread's longest tasks of opening the design workspace.
    cssCodeSplit: false,
    // The page's own entry keeps its <link rel="modulepreload"> list, but a lazily loaded view
    // does not: Vite's helper appended a link per dependency as the route resolved (dozens for
    // the design workspace), and in Chromium those insertions alone held the main thread for
    // 50-180 ms at 4x CPU throttling (npm run bench -- firstload). The browser still loads a
    // view's imports in parallel as it reads the view's chunk; files are cached immutable.
    modulePreload: {
      resolveDependencies: (_file, deps, { hostType }) => (hostType === 'html' ? deps : []),
    },
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
