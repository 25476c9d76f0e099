import { defineConfig } from 'vitest/config'
import { defineVitestProject } from '@nuxt/test-utils/config'

// Four layers (see DEVELOPERS.md):
// - unit:      pure shared/ core, node environment, no app needed
// - component: app components mounted in happy-dom (@nuxt/test-utils' nuxt environment, so
//              auto-imports, aliases and Pinia work as in the app; @vue/test-utils underneath)
// - server:    real HTTP against the built server on a temporary SQLite file
// - e2e:       real Chromium (playwright-core, /usr/bin/chromium) against the built server
//
// Loading Nuxt for the component project costs seconds at every vitest start, so it is set up
// only when that project can run (no --project filter, or --project component).
const argv = process.argv.join(' ')
const componentWanted = !/--project[= ]/.test(argv) || /--project[= ]component\b/.test(argv)
const componentProject = componentWanted
  ? [await defineVitestProject({
      test: {
        name: 'component',
        include: ['tests/component/**/*.test.ts'],
        environment: 'nuxt',
        environmentOptions: { nuxt: { domEnvironment: 'happy-dom' } },
        testTimeout: 60_000,
        hookTimeout: 120_000,
      },
    })]
  : []

export default defineConfig({
  test: {
    projects: [
      {
        test: {
          name: 'unit',
          include: ['tests/unit/**/*.test.ts'],
          environment: 'node',
          testTimeout: 60_000,
        },
      },
      ...componentProject,
      {
        test: {
          name: 'server',
          include: ['tests/server/**/*.test.ts'],
          environment: 'node',
          testTimeout: 60_000,
          hookTimeout: 120_000,
          fileParallelism: false,
        },
      },
      {
        test: {
          name: 'e2e',
          include: ['tests/e2e/**/*.test.ts'],
          environment: 'node',
          testTimeout: 120_000,
          hookTimeout: 180_000,
          fileParallelism: false,
        },
      },
    ],
  },
})
