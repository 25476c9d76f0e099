// https://nuxt.com/docs/api/configuration/nuxt-config
export default defineNuxtConfig({
  compatibilityDate: '2026-11-01',
  devtools: { enabled: false },
  // WINGFOLD_BUILD_DIR / WINGFOLD_OUTPUT_DIR let two builds of one checkout coexist (e.g. a
  // developer's build while another one is under test); tests/support/server.ts reads the same
  // variable. Unset: Nuxt's usual .nuxt and .output.
  buildDir: process.env.WINGFOLD_BUILD_DIR || '.nuxt',
  nitro: { output: { dir: process.env.WINGFOLD_OUTPUT_DIR || '.output' } },
  modules: ['@pinia/nuxt', '@nuxtjs/tailwindcss', 'nuxt-auth-utils', 'nuxt-security'],
  // Security headers on every response (nuxt-security; policy explained in docs/security.md). Its
  // rate limiter, body-size limiter, XSS filter and CORS handler are off: Wingfold has its own
  // sign-in limits, limits bodies while reading them (also chunked) and serves no other origin.
  security: {
    headers: {
      contentSecurityPolicy: {
        'default-src': ["'self'"],
        'script-src': ["'self'", "'strict-dynamic'", "'nonce-{{nonce}}'"],
        'script-src-attr': ["'none'"],
        // Vue style bindings and ECharts set inline styles.
        'style-src': ["'self'", "'unsafe-inline'"],
        // ECharts canvas and SVG output, data: images; the bundled Space Grotesk files.
        'img-src': ["'self'", 'data:', 'blob:'],
        'font-src': ["'self'", 'data:'],
        // The comlink module workers (pattern, continuation, map).
        'worker-src': ["'self'", 'blob:'],
        'connect-src': ["'self'"],
        'object-src': ["'none'"],
        'base-uri': ["'none'"],
        'form-action': ["'self'"],
        'frame-ancestors': ["'none'"],
        'upgrade-insecure-requests': false,
      },
      crossOriginEmbedderPolicy: false,
      xFrameOptions: 'DENY',
      // Same-origin requests keep their Origin and Referer (the cross-site check reads them);
      // nothing leaks to other sites.
      referrerPolicy: 'same-origin',
    },
    rateLimiter: false,
    requestSizeLimiter: false,
    xssValidator: false,
    corsHandler: false,
    removeLoggers: false,
  },
  css: [
    '@fontsource/space-grotesk/400.css',
    '@fontsource/space-grotesk/500.css',
    '@fontsource/space-grotesk/700.css',
    '~/assets/css/main.css',
  ],
  app: {
    head: {
      title: 'Wingfold',
      htmlAttrs: { lang: 'en' },
      meta: [{ name: 'description', content: 'Check gluing patterns, follow their balanced families, keep them as verified runs.' }],
    },
  },
  // Every key can be overridden by an environment variable: NUXT_<KEY_IN_SNAKE_CASE> (README table).
  runtimeConfig: {
    databaseUrl: 'file:./data/wingfold.db',
    migrationsDir: '',
    allowSignup: true,
    seedDemo: true,
    trustProxy: false,
    // Security settings (docs/security.md): sign-in failures per account within the window → 429;
    // per address a delay base·2^(n − free) ms up to max, never a lock; reset requests apart.
    signInLimit: { perAccount: 5, windowMinutes: 15, freeAddressFailures: 10, delayBaseMs: 250, delayMaxMs: 8000 },
    resetLimit: { perAccount: 3, perAddress: 20, windowMinutes: 60 },
    sessionLifetime: { idleMinutes: 1440, absoluteHours: 168 },
    bodyLimit: { defaultBytes: 1_000_000 },
    // A run with no batch and no finish for this long is ended as "interrupted" (checked every runSweepSeconds).
    runIdleMinutes: 30,
    runSweepSeconds: 60,
    smtpUrl: '',
    mailFrom: 'Wingfold <no-reply@wingfold.local>',
    // project archive import limits (docs/archives.md) and scheduled backups (docs/backups.md)
    archiveImport: { maxMb: 64, maxEntries: 64, maxInflatedMb: 256, maxRatio: 100 },
    backup: { intervalMinutes: 0, dir: './data/backups', keep: 7 },
    /** Redis URL for census jobs on BullMQ workers; empty: census jobs run in the web process. */
    censusRedisUrl: '',
    public: {
      appVersion: '0.1.0',
      baseUrl: 'http://localhost:3000',
    },
  },
  // nuxt-security puts its policy on HTML only; API answers (JSON, CSV) load nothing, so they get
  // the strictest policy (OWASP REST Security Cheat Sheet, "Security headers").
  routeRules: {
    '/api/**': { headers: { 'content-security-policy': "default-src 'none'; frame-ancestors 'none'" } },
  },
  tailwindcss: { configPath: 'tailwind.config.ts', cssPath: false },
  vite: {
    worker: { format: 'es' },
    optimizeDeps: {
      include: ['comlink', 'echarts/core', 'echarts/charts', 'echarts/components', 'echarts/renderers', 'vue-echarts', 'mathjs', 'ml-matrix', 'zod'],
    },
  },
  // the component tests mount app components, so they are type-checked with the app's types
  typescript: { strict: true, tsConfig: { include: ['../tests/component/**/*'] } },
})
