// Gammaboard: Nuxt 4 in the root-level layout (no app/ folder — creating one switches the source dir).
import { workerSourceModule } from './server/workers/bundle'

export default defineNuxtConfig({
  compatibilityDate: '2026-01-01',
  devtools: { enabled: false },
  telemetry: false,
  modules: ['@pinia/nuxt', '@nuxtjs/tailwindcss', 'nuxt-auth-utils'],
  css: ['@fontsource/work-sans/400.css', '@fontsource/work-sans/600.css', '~/assets/css/main.css'],
  tailwindcss: { cssPath: false, configPath: 'tailwind.config.ts', viewer: false },
  app: {
    head: {
      title: 'Gammaboard',
      meta: [{ name: 'description', content: 'Impedance matching on the reflection-coefficient plane, together.' }],
    },
  },
  runtimeConfig: {
    // The sealed cookie's absolute lifetime, in seconds: 30 days, the same as SESSION_MAX_MS in
    // server/utils/sessions.ts (the server ends idle sessions sooner).
    session: { maxAge: 30 * 24 * 60 * 60 },
  },
  nitro: {
    experimental: { websocket: true },
    // Server worker threads, bundled into strings (server/workers/bundle.ts explains why).
    virtual: {
      '#search-worker-source': () => workerSourceModule('server/workers/search-run.ts'),
      '#touchstone-worker-source': () => workerSourceModule('server/workers/touchstone-parse.ts'),
    },
  },
  vite: {
    optimizeDeps: { include: ['complex.js', 'vue-konva', 'konva', 'yjs', 'y-websocket', 'uplot', 'sortablejs'] },
  },
  typescript: { strict: true },
})
