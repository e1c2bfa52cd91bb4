import withNuxt from './.nuxt/eslint.config.mjs'

export default withNuxt(
  { ignores: ['.data/**', 'drizzle/**', 'test-results/**', 'bench/scratch/**'] },
  // Tests read JSON replies whose shape each assertion checks itself.
  { files: ['tests/**'], rules: { '@typescript-eslint/no-explicit-any': 'off' } },
)
