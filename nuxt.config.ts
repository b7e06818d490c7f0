import { fileURLToPath } from 'node:url'
import tailwindcss from '@tailwindcss/vite'

// EDDY_BUILD_SLOT gives a parallel build its own folders (several developers on one machine).
const slot = process.env.EDDY_BUILD_SLOT
const sharedDir = fileURLToPath(new URL('./shared/', import.meta.url))

export default defineNuxtConfig({
  compatibilityDate: '2025-07-15',
  ...(slot ? { buildDir: `.nuxt-${slot}` } : {}),
  nitro: {
    ...(slot ? { output: { dir: `.output-${slot}` } } : {}),
    // Every built script and stylesheet also as .gz and .br beside it; the static handler sends
    // the one the browser accepts.
    compressPublicAssets: { gzip: true, brotli: true },
    // The PDF record embeds these fonts (server/utils/report/fonts.ts); the tracer cannot see a path
    // built at run time, so name them.
    externals: {
      traceInclude: ['DejaVuSans.ttf', 'DejaVuSans-Bold.ttf', 'DejaVuSans-Oblique.ttf', 'DejaVuSansMono.ttf']
        .map(file => `node_modules/dejavu-fonts-ttf/ttf/${file}`),
    },
  },
  devtools: { enabled: false },
  telemetry: false,
  modules: ['@pinia/nuxt', 'nuxt-auth-utils', '@nuxt/eslint'],
  eslint: { config: { stylistic: false } },
  css: ['~/assets/css/main.css'],
  vite: {
    plugins: [tailwindcss()],
    build: {
      rollupOptions: {
        // shared/ is pure code (the engine validates its ruleset when loaded, nothing else): a module
        // whose exports a page does not use is left out, so importing approach labels from the
        // engine's index does not ship the engine, its ruleset and their parsers to that page.
        treeshake: { moduleSideEffects: id => !id.startsWith(sharedDir) },
      },
    },
  },
  app: {
    head: {
      title: 'Eddyledger',
      htmlAttrs: { lang: 'en' },
      meta: [{ name: 'description', content: 'Turbulence-approach decisions for CFD teams' }],
    },
  },
  runtimeConfig: {
    // Overridden at run time by NUXT_DATABASE_URL / DATABASE_URL (see server/utils/db.ts).
    databaseUrl: '',
    appUrl: 'http://127.0.0.1:3000',
    smtp: { host: '127.0.0.1', port: 1025, user: '', pass: '', from: 'Eddyledger <no-reply@eddyledger.test>', secure: false },
    session: { maxAge: 60 * 60 * 12 },
    // Failed sign-ins allowed per window before a lock of the same length.
    loginLimit: { accountFailures: 5, clientFailures: 30, windowMinutes: 15, trustProxy: false },
    // S3-compatible object storage for uploads (NUXT_STORAGE_*). npm start and npm test point it
    // at a local fake (s3rver); production names a real bucket and, unless the platform provides
    // credentials, its keys.
    storage: { endpoint: '', region: 'us-east-1', bucket: 'eddyledger-uploads', accessKeyId: '', secretAccessKey: '', forcePathStyle: false },
  },
  typescript: { strict: true },
  hooks: {
    // No prefetch hints for dynamically imported chunks (other pages, lazy components): the
    // browser downloads what the page shows, and the rest when it is used. Links to other pages
    // still prefetch their page as they come into view.
    'build:manifest': (manifest) => {
      for (const chunk of Object.values(manifest)) chunk.prefetch = false
    },
  },
})
