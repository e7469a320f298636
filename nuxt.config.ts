// Nuxt configuration. Everything the browser loads is served by the app itself (fonts included).
import { bundleScoreWorker } from './scripts/lib/score-worker.mjs'
export default defineNuxtConfig({
  compatibilityDate: '2026-01-01',
  devtools: { enabled: false },
  telemetry: false,
  buildDir: process.env.WW_NUXT_DIR || '.nuxt',
  modules: ['@nuxtjs/tailwindcss', '@pinia/nuxt', 'nuxt-auth-utils', 'nuxt-security', '@vite-pwa/nuxt'],
  // response headers from nuxt-security; request checks (origin, body type and size) are server/middleware/request-guard.ts
  security: {
    nonce: true,
    headers: {
      contentSecurityPolicy: {
        'default-src': ["'self'"],
        'base-uri': ["'none'"],
        'connect-src': ["'self'"],
        'font-src': ["'self'"],
        'form-action': ["'self'"],
        'frame-ancestors': ["'none'"],
        'img-src': ["'self'", 'data:', 'blob:'],
        'object-src': ["'none'"],
        'script-src-attr': ["'none'"],
        // Vue binds style attributes and Konva sizes its canvas inline
        'style-src': ["'self'", "'unsafe-inline'"],
        'script-src': ["'self'", "'strict-dynamic'", "'nonce-{{nonce}}'"],
        'worker-src': ["'self'", 'blob:'],
        'upgrade-insecure-requests': false,
      },
      crossOriginEmbedderPolicy: false,
      referrerPolicy: 'strict-origin-when-cross-origin',
      xFrameOptions: 'DENY',
      // browsers ignore HSTS received over plain HTTP (RFC 6797 8.1), so it only takes effect behind HTTPS
      strictTransportSecurity: { maxAge: 31536000, includeSubdomains: true },
      permissionsPolicy: { camera: [], microphone: [], geolocation: [], 'display-capture': [], fullscreen: ['self'] },
    },
    // no per-instance state: sign-in throttling is in the database (server/services/accounts.ts)
    rateLimiter: false,
    // body caps per route, streamed bodies included, are in server/utils/request-policy.ts
    requestSizeLimiter: false,
    // bodies are validated by zod schemas; this filter rejects ordinary text such as "<3 bees"
    xssValidator: false,
    corsHandler: false,
    hidePoweredBy: true,
  },
  routeRules: {
    // API answers are personal (or cheap to recompute): never kept by a browser or a shared cache
    '/api/**': { headers: { 'cache-control': 'no-store' } },
  },
  css: [
    '@fontsource/nunito/400.css',
    '@fontsource/nunito/600.css',
    '@fontsource/nunito/700.css',
    '@fontsource/nunito/800.css',
    '~/assets/css/main.css',
  ],
  app: {
    head: {
      htmlAttrs: { lang: 'en' },
      title: 'Wildward',
      meta: [
        { name: 'viewport', content: 'width=device-width, initial-scale=1' },
        { name: 'description', content: 'Plan a yard that is at least 70 % native plants.' },
        { name: 'theme-color', content: '#2f5d50' },
      ],
      link: [{ rel: 'icon', type: 'image/svg+xml', href: '/favicon.svg' }],
    },
  },
  runtimeConfig: {
    databaseUrl: '',
    smtpUrl: '',
    mailFrom: 'Wildward <no-reply@wildward.invalid>',
    mailCaptureUrl: '',
    appUrl: 'http://127.0.0.1:3000',
    demoData: false,
    // demo mode away from loopback only when asked for in so many words (server/utils/demo.ts)
    demoExplicit: false,
    uploadDir: '.data/uploads',
    uploadDriver: 'fs',
    // for uploadDriver 's3': an S3-compatible bucket (NUXT_UPLOAD_S3_ENDPOINT, _BUCKET, _REGION, _ACCESS_KEY_ID, _SECRET_ACCESS_KEY)
    uploadS3: { endpoint: '', region: '', bucket: '', accessKeyId: '', secretAccessKey: '' },
    loginThrottlePerEmail: 5,
    loginThrottlePerAddress: 30,
    trustProxy: false,
    // background jobs (server/plugins/jobs.ts): how often each instance looks for due jobs; 0 turns it off
    jobsIntervalMs: 5000,
    jobsBatchSize: 50,
    // sessions end on the server (table sessions): after this long unused, and at the latest after session.maxAge
    sessionIdleSeconds: 60 * 60 * 24 * 3,
    // the hosted payment service through its official SDK: keys from NUXT_PAYMENTS_SECRET_KEY and
    // NUXT_PAYMENTS_WEBHOOK_SECRET; apiHost/apiPort/apiProtocol only point it at the local fake (empty: the real one)
    payments: { secretKey: '', webhookSecret: '', apiHost: '', apiPort: '', apiProtocol: '', currency: 'usd' },
    session: {
      // over HTTPS the start script makes these __Host-wildward-session and secure (sessionCookieEnv in scripts/lib/services.mjs)
      name: 'wildward-session',
      cookie: { sameSite: 'lax', secure: false, path: '/' },
      maxAge: 60 * 60 * 24 * 14,
      password: '',
    },
    public: {
      demoMode: false,
    },
  },
  nitro: {
    output: { dir: process.env.WW_OUTPUT_DIR || '.output' },
    hooks: {
      // the score engine's worker thread is bundled beside the server (server/services/score-pool.ts)
      async compiled(nitro) {
        if (!nitro.options.dev) await bundleScoreWorker(nitro.options.output.serverDir)
      },
    },
    // brotli and gzip copies of JS, CSS, SVG and JSON made at build; answers the server makes are compressed by
    // server/plugins/compression.ts
    compressPublicAssets: { brotli: true, gzip: true },
  },
  // the installable app: manifest and service worker made at build (Workbox), nothing fetched from elsewhere;
  // pages and the API answers a visit needs are kept for offline use (see DEVELOPERS.md "Offline")
  pwa: {
    registerType: 'autoUpdate',
    // registered after the page has loaded by app/plugins/offline.client.ts, so the page's own files come first
    injectRegister: false,
    client: { registerPlugin: false },
    manifest: {
      name: 'Wildward',
      short_name: 'Wildward',
      description: 'Plan a yard that is at least 70 % native plants.',
      lang: 'en-US',
      start_url: '/yards',
      display: 'standalone',
      theme_color: '#2f5d50',
      background_color: '#fbfaf6',
      icons: [
        { src: '/icon-192.png', sizes: '192x192', type: 'image/png' },
        { src: '/icon-512.png', sizes: '512x512', type: 'image/png' },
        { src: '/icon-512.png', sizes: '512x512', type: 'image/png', purpose: 'maskable' },
      ],
    },
    workbox: {
      // pages are rendered on the server: no single app shell to fall back to
      navigateFallback: null,
      globPatterns: ['_nuxt/**/*.{js,css}', '_nuxt/nunito-latin-*.woff2', '*.{svg,png}'],
      cleanupOutdatedCaches: true,
      skipWaiting: true,
      clientsClaim: true,
      runtimeCaching: [
        // pages: the network first, the last copy when offline
        { urlPattern: ({ request, url }) => request.mode === 'navigate' && !url.pathname.startsWith('/api/'), handler: 'NetworkFirst', options: { cacheName: 'ww-pages', networkTimeoutSeconds: 8, cacheableResponse: { statuses: [200] }, expiration: { maxEntries: 60 } } },
        // what the editor and a visit read (GET only; never sign-in or writes)
        { urlPattern: ({ url }) => /^\/api\/(yards|visits|species|fits|auth\/me|_auth\/session)\b/.test(url.pathname), method: 'GET', handler: 'NetworkFirst', options: { cacheName: 'ww-api', networkTimeoutSeconds: 8, cacheableResponse: { statuses: [200] }, expiration: { maxEntries: 200 } } },
      ],
    },
  },
  vite: {
    optimizeDeps: {
      include: ['konva', 'vue-konva', 'polygon-clipping', 'chart.js', 'vue-chartjs', 'papaparse'],
    },
  },
  // links fetch (and run) the next page's code when touched or hovered, not as soon as they are on screen: on a
  // phone that idle work and its bandwidth would land while the page itself is still loading
  experimental: {
    defaults: { nuxtLink: { prefetchOn: { interaction: true, visibility: false } } },
  },
  typescript: {
    strict: true,
  },
})
