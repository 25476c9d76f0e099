// https://nuxt.com/docs/api/configuration/nuxt-config
export default defineNuxtConfig({
  compatibilityDate: '2026-11-01',
  devtools: { enabled: false },
  // WINGFOLD_BUILD_DIR / WINGFOLD_OUTPUT_DIR let two builds of one checkout coexist (e.g. a
  // developer's build while another one is under test); tests/support/server.ts reads the same
  // variable. Unset: Nuxt's usual .nuxt and .output.
  buildDir: process.env.WINGFOLD_BUILD_DIR || '.nuxt',
  nitro: { output: { dir: process.env.WINGFOLD_OUTPUT_DIR || '.output' } },
  modules: ['@pinia/nuxt', '@nuxtjs/tailwindcss', 'nuxt-auth-utils'],
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
    signInLimit: { perAccount: 5, perAddress: 30, windowMinutes: 15 },
    smtpUrl: '',
    mailFrom: 'Wingfold <no-reply@wingfold.local>',
    // project archive import limits (docs/archives.md) and scheduled backups (docs/backups.md)
    archiveImport: { maxMb: 64, maxEntries: 64, maxInflatedMb: 256, maxRatio: 100 },
    backup: { intervalMinutes: 0, dir: './data/backups', keep: 7 },
    public: {
      appVersion: '0.1.0',
      baseUrl: 'http://localhost:3000',
    },
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
