// Polewright: root layout (no app/ folder), every remote fetch off, fonts shipped with the app.
import { fileURLToPath } from 'node:url'

const migrationsDir = fileURLToPath(new URL('./db/migrations', import.meta.url))

export default defineNuxtConfig({
  compatibilityDate: '2026-01-01',
  srcDir: '.',
  serverDir: 'server',
  dir: { public: 'public' },
  // Separate build dirs let several people build the same checkout at once.
  buildDir: process.env.NUXT_BUILD_DIR || '.nuxt',
  telemetry: false,
  devtools: { enabled: false },
  modules: ['@pinia/nuxt', '@nuxtjs/tailwindcss', 'nuxt-auth-utils', 'nuxt-security'],
  css: [
    '@fontsource/space-grotesk/400.css',
    '@fontsource/space-grotesk/500.css',
    '@fontsource/space-grotesk/700.css',
    'katex/dist/katex.min.css',
    '@vue-flow/core/dist/style.css',
    '@vue-flow/core/dist/theme-default.css',
    '~/assets/main.css',
  ],
  app: {
    head: {
      title: 'Polewright',
      htmlAttrs: { lang: 'en' },
      link: [{ rel: 'icon', type: 'image/svg+xml', href: '/favicon.svg' }],
      meta: [{ name: 'description', content: 'A shared workbench for on-shell recursion of scattering amplitudes.' }],
    },
  },
  tailwindcss: { viewer: false },
  runtimeConfig: {
    // Absolute, because the built .output does not carry the SQL files.
    migrationsDir: process.env.POLEWRIGHT_MIGRATIONS_DIR || migrationsDir,
    session: {
      cookie: { sameSite: 'lax', secure: process.env.POLEWRIGHT_INSECURE_COOKIE !== '1' },
      maxAge: 60 * 60 * 24 * 14,
    },
  },
  // The exact arithmetic uses BigInt literals.
  vite: { build: { target: 'es2022' }, esbuild: { target: 'es2022' }, optimizeDeps: { esbuildOptions: { target: 'es2022' } } },
  nitro: {
    esbuild: { options: { target: 'es2022' } },
    output: process.env.NUXT_OUTPUT_DIR ? { dir: process.env.NUXT_OUTPUT_DIR } : undefined,
    experimental: { tasks: false },
  },
  security: {
    // Bracket formulas such as <1 2> are ordinary input; output is escaped by Vue and KaTeX (trust: false).
    xssValidator: false,
    // A global limiter would throttle scripts and batch runs; sign-in and reset are throttled per e-mail instead.
    rateLimiter: false,
    requestSizeLimiter: { maxRequestSizeInBytes: 4_000_000, maxUploadFileRequestInBytes: 12_000_000, throwError: true },
    corsHandler: false,
    headers: {
      crossOriginEmbedderPolicy: 'unsafe-none',
      contentSecurityPolicy: {
        // Everything comes from the app itself: fonts are shipped, KaTeX and Vue Flow are bundled,
        // fetches and the batch event stream are same-origin (ws: only for the dev server's reload).
        'default-src': ["'self'"],
        'connect-src': process.env.NODE_ENV === 'development' ? ["'self'", 'ws:'] : ["'self'"],
        'img-src': ["'self'", 'data:', 'blob:'],
        'font-src': ["'self'", 'data:'],
        'style-src': ["'self'", "'unsafe-inline'"],
        'script-src': ["'self'", "'unsafe-inline'", "'strict-dynamic'", "'nonce-{{nonce}}'"],
        'upgrade-insecure-requests': false,
      },
      strictTransportSecurity: false,
    },
  },
  typescript: { strict: true },
  routeRules: {
    // Point-file uploads: the route itself refuses files over 10 MB with a message naming the field;
    // the global 12 MB cap would answer first with a bare 413, so it is raised here as a backstop only.
    '/api/projects/*/point-sets': { security: { requestSizeLimiter: { maxRequestSizeInBytes: 4_000_000, maxUploadFileRequestInBytes: 64_000_000, throwError: true } } },
  },
})
