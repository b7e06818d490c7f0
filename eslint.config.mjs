// ESLint on Nuxt's generated base (@nuxt/eslint: Vue, TypeScript, import rules for this project's
// layout), with a few rules of the house. `npm run lint`; `npm test` runs it.
import withNuxt from './.nuxt/eslint.config.mjs'

// Node 20 lacks Object.groupBy (Node 21+), which the config composer calls when ESLint resolves it.
Object.groupBy ??= (items, key) => items.reduce((groups, item, index) => {
  ;(groups[key(item, index)] ??= []).push(item)
  return groups
}, Object.create(null))

export default withNuxt(
  {
    ignores: ['.output*/**', '.nuxt*/**', 'node_modules/**', 'server/db/migrations/**', 'tests/artifacts/**', 'test-results*/**', 'playwright-report/**', '.pg*/**'],
  },
  {
    rules: {
      // Unused parameters named with a leading underscore are intentional (callbacks' positions).
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
      // A few response shapes from third parties (maildev, pdfkit internals) are read loosely in tests.
      '@typescript-eslint/no-explicit-any': 'off',
    },
  },
)
