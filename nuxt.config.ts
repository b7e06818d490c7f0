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
  modules: ['@pinia/nuxt', 'nuxt-auth-utils', '@nuxt/eslint', 'nuxt-security'],
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
    // password: NUXT_SESSION_PASSWORD at run time (nuxt-auth-utils refuses to start without it in production).
    session: { maxAge: 60 * 60 * 12, password: '' },
    // Sign-in attempts allowed per account from one address, per address, and per account from all
    // addresses together, before growing waits (delaySeconds, doubling up to the window); see
    // server/utils/auth/login-limiter.ts. trustProxy: read the client address and protocol from X-Forwarded-*.
    loginLimit: { accountFailures: 5, clientFailures: 30, accountTotalFailures: 100, windowMinutes: 15, delaySeconds: 30, trustProxy: false },
    invitationResendsPerHour: 3,
    // Request bodies: JSON on every write route, files on the declared upload routes (server/utils/http/uploads.ts).
    bodyLimit: { jsonBytes: 1024 * 1024, uploadBytes: 64 * 1024 * 1024 },
    // How long a message being sent is leased to one server process (renewed while it lasts).
    mail: { leaseSeconds: 120 },
    // S3-compatible object storage for uploads (NUXT_STORAGE_*). npm start and npm test point it
    // at a local fake (s3rver); production names a real bucket and, unless the platform provides
    // credentials, its keys.
    storage: { endpoint: '', region: 'us-east-1', bucket: 'eddyledger-uploads', accessKeyId: '', secretAccessKey: '', forcePathStyle: false },
    // The ledger (server/utils/ledger): the signing key (PEM or base64 PKCS #8; else the key file),
    // retired public keys trusted besides it, and the checkpoint and verification schedule.
    ledger: {
      signingKey: '',
      keyFile: '.secrets/ledger-signing-key',
      trustedKeys: '',
      keyringFile: '.secrets/ledger-public-keys',
      checkpointEvery: 100,
      checkpointMinutes: 60,
      pollSeconds: 30,
      verifyMinutes: 60,
    },
  },
  // Security headers (nuxt-security). Our own middleware (server/middleware/00.web-surface.ts) does
  // the request-side work: cross-site writes, content types, body sizes and HSTS over TLS only.
  security: {
    headers: {
      contentSecurityPolicy: {
        'default-src': ["'self'"],
        'base-uri': ["'none'"],
        'connect-src': ["'self'"],
        // The fonts are bundled (@fontsource-variable); nothing is loaded from another site.
        'font-src': ["'self'", 'data:'],
        'form-action': ["'self'"],
        'frame-ancestors': ["'none'"],
        'img-src': ["'self'", 'data:', 'blob:'],
        'object-src': ["'none'"],
        'script-src': ["'self'", "'strict-dynamic'", "'nonce-{{nonce}}'"],
        'script-src-attr': ["'none'"],
        // Vue renders style attributes (chart heights, transitions): inline styles, never inline scripts.
        'style-src': ["'self'", "'unsafe-inline'"],
        'worker-src': ["'self'", 'blob:'],
        // Plain-HTTP local set-ups must keep working; HTTPS deployments get HSTS instead.
        'upgrade-insecure-requests': false,
      },
      xFrameOptions: 'DENY',
      referrerPolicy: 'same-origin',
      // Sent by our middleware, and only over TLS.
      strictTransportSecurity: false,
    },
    // Ours are in server/middleware (413 with the upload routes' own caps; limits in PostgreSQL).
    requestSizeLimiter: false,
    rateLimiter: false,
    // Notes and comments may hold "<" and ">" legitimately; output is escaped and sanitised instead.
    xssValidator: false,
    hidePoweredBy: true,
  },
  routeRules: {
    // JSON, CSV and PDF answers are not documents that run scripts; a CSP there only gets in the
    // way of the browser's PDF viewer.
    '/api/**': { security: { headers: { contentSecurityPolicy: false } } },
  },
  typescript: { strict: true },
  hooks: {
    // No prefetch hints for dynamically imported chunks (other pages, lazy components): the
    // browser downloads what the page shows, and the rest when it is used.
    'build:manifest': (manifest) => {
      for (const chunk of Object.values(manifest)) chunk.prefetch = false
    },
  },
  experimental: {
    // A link prefetches its page when pointed at or focused, not as it scrolls into view: a list
    // of a hundred decisions would otherwise fetch the decision page (its chart and markdown code)
    // before anyone chose one.
    defaults: { nuxtLink: { prefetchOn: { visibility: false, interaction: true } } },
  },
})
