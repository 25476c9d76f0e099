// ESLint flat config: Nuxt's own flat config (@nuxt/eslint-config) for Vue + TypeScript, with the
// project's few choices on top. `npm run lint` runs it; `npm test` runs it first.
import { createConfigForNuxt } from '@nuxt/eslint-config/flat'

// eslint-flat-config-utils 3 (under @nuxt/eslint-config) calls Object.groupBy, which Node 20 lacks
// (it arrived in Node 21); the tiny standard-behaviour fallback below keeps ESLint on Node 20.19.
if (typeof Object.groupBy !== 'function') {
  Object.groupBy = (items, key) => {
    const out = Object.create(null)
    let i = 0
    for (const item of items) (out[key(item, i++)] ??= []).push(item)
    return out
  }
}

export default createConfigForNuxt({
  features: { typescript: true, stylistic: false },
  dirs: { src: ['app', 'server', 'shared', 'workers', 'cli', 'bench', 'tests'] },
})
  .append({
    ignores: ['.nuxt*/**', '.output*/**', 'node_modules/**', 'data/**', 'tests/artifacts/**', 'server/migrations/**', 'docs/**'],
  })
  .append({
    rules: {
      // Our templates keep the first attribute on the tag's line and wrap the rest beneath it.
      'vue/first-attribute-linebreak': 'off',
    },
  })
