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
      // Zod 4 probes `new Function` when a module first builds an object schema; our policy has no
      // 'unsafe-eval', so the probe fails quietly but Chromium reports a violation. Jitless mode
      // (zod's global config, read from globalThis) skips it; this runs before any module script.
      script: [{ innerHTML: 'globalThis.__zod_globalConfig=Object.assign(globalThis.__zod_globalConfig||{},{jitless:true})', tagPosition: 'head' }],
    },
  },
  runtimeConfig: {
    // The sealed cookie's absolute lifetime, in seconds: 30 days, the same as SESSION_MAX_MS in
    // server/utils/sessions.ts (the server ends idle sessions sooner).
    session: { maxAge: 30 * 24 * 60 * 60 },
  },
  routeRules: {
    // Every response, assets and API included. The pages' Content-Security-Policy (with its
    // per-page nonce) is set in server/plugins/security-headers.ts, on pages only: a worker runs
    // under its own script's response policy, so assets must not carry a page's.
    '/**': {
      headers: {
        'x-content-type-options': 'nosniff',
        'x-frame-options': 'DENY',
        'referrer-policy': 'same-origin',
      },
    },
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
