// Plumbline: Nuxt 4 app. Secrets and URLs come from the environment at run time
// (NUXT_* variables override runtimeConfig); scripts/start.sh sets safe local
// defaults for the demo.
export default defineNuxtConfig({
  compatibilityDate: '2026-11-01',
  devtools: { enabled: false },
  telemetry: false,
  modules: ['@pinia/nuxt', '@nuxtjs/tailwindcss', 'nuxt-auth-utils', '@vueuse/nuxt', '@nuxt/eslint'],
  css: [
    '@fontsource/source-serif-4/400.css',
    '@fontsource/source-serif-4/400-italic.css',
    '@fontsource/source-serif-4/600.css',
    '@fontsource/source-code-pro/400.css',
    '@fontsource/source-code-pro/600.css',
    '~/assets/css/main.css',
  ],
  app: {
    head: {
      htmlAttrs: { lang: 'en' },
      title: 'Plumbline',
      meta: [
        { name: 'viewport', content: 'width=device-width, initial-scale=1' },
        { name: 'description', content: 'Verification registry for Hermite-family numerical codes' },
      ],
      link: [{ rel: 'icon', type: 'image/svg+xml', href: '/favicon.svg' }],
    },
  },
  runtimeConfig: {
    databaseUrl: '',
    session: {
      name: 'plumbline-session',
      password: '',
      maxAge: 60 * 60 * 12,
      cookie: { sameSite: 'lax', httpOnly: true, secure: false },
    },
    trustProxy: false,
    loginLimit: { perAccount: 5, perAddress: 20, windowMinutes: 15 },
  },
  nitro: {
    experimental: { tasks: false },
    esbuild: { options: { target: 'es2022' } },
  },
  // The engine and the judging rules (shared/) use BigInt literals.
  vite: {
    build: { target: 'es2022' },
    esbuild: { target: 'es2022' },
    optimizeDeps: { esbuildOptions: { target: 'es2022' } },
  },
  // The API's own route table (method and path of every handler under /api),
  // so unknown routes can be told apart from wrong methods (404 vs 405).
  hooks: {
    'nitro:init'(nitro) {
      nitro.options.virtual['#plumbline/api-routes'] = () => {
        const routes = [...nitro.scannedHandlers, ...nitro.options.handlers]
          .filter(h => h.route?.startsWith('/api/') && !h.middleware && !h.route.includes('**'))
          .map(h => ({ route: h.route!, method: (h.method ?? 'all').toUpperCase() }))
        return `export default ${JSON.stringify(routes)}`
      }
    },
  },
  typescript: { strict: true },
  eslint: { config: { stylistic: false } },
})
