// Lint: Nuxt's generated config (TypeScript, Vue, imports, stylistic rules set in nuxt.config.ts),
// written by `nuxt prepare` (run on install) into .nuxt/eslint.config.mjs.
import withNuxt from './.nuxt/eslint.config.mjs'

export default withNuxt(
  { ignores: ['.nuxt*/**', '.output*/**', 'data/**', '.data/**', 'db/migrations/**', 'tests/screenshots/**'] },
  {
    rules: {
      'vue/multi-word-component-names': 'off',
      'vue/max-attributes-per-line': 'off',
      'vue/singleline-html-element-content-newline': 'off',
      'vue/html-self-closing': 'off',
      'vue/no-v-html': 'off',
      '@typescript-eslint/no-explicit-any': 'off',
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
      // The code's own habits: short blocks on one line, arrow parameters with or without parentheses,
      // quotes inside strings without escapes, members of a type separated by commas or semicolons.
      '@stylistic/max-statements-per-line': 'off',
      '@stylistic/arrow-parens': 'off',
      '@stylistic/quotes': ['error', 'single', { avoidEscape: true, allowTemplateLiterals: 'always' }],
      '@stylistic/member-delimiter-style': 'off',
      // nuxt.config.ts is grouped by topic, not by the module's key order.
      'nuxt/nuxt-config-keys-order': 'off',
    },
  },
)
