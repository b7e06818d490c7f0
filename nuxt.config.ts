import tailwindcss from '@tailwindcss/vite'

// EDDY_BUILD_SLOT gives a parallel build its own folders (several developers on one machine).
const slot = process.env.EDDY_BUILD_SLOT

export default defineNuxtConfig({
  compatibilityDate: '2025-07-15',
  ...(slot ? { buildDir: `.nuxt-${slot}`, nitro: { output: { dir: `.output-${slot}` } } } : {}),
  devtools: { enabled: false },
  telemetry: false,
  modules: ['@pinia/nuxt', 'nuxt-auth-utils'],
  css: ['~/assets/css/main.css'],
  vite: { plugins: [tailwindcss()] },
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
  },
  typescript: { strict: true },
})
