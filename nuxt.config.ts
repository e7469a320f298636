// Nuxt configuration. Everything the browser loads is served by the app itself (fonts included).
export default defineNuxtConfig({
  compatibilityDate: '2026-01-01',
  devtools: { enabled: false },
  telemetry: false,
  buildDir: process.env.WW_NUXT_DIR || '.nuxt',
  modules: ['@nuxtjs/tailwindcss', '@pinia/nuxt', 'nuxt-auth-utils'],
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
    // the hosted payment service through its official SDK: keys from NUXT_PAYMENTS_SECRET_KEY and
    // NUXT_PAYMENTS_WEBHOOK_SECRET; apiHost/apiPort/apiProtocol only point it at the local fake (empty: the real one)
    payments: { secretKey: '', webhookSecret: '', apiHost: '', apiPort: '', apiProtocol: '', currency: 'usd' },
    session: {
      maxAge: 60 * 60 * 24 * 14,
      password: '',
    },
    public: {
      demoMode: false,
    },
  },
  nitro: {
    output: { dir: process.env.WW_OUTPUT_DIR || '.output' },
  },
  vite: {
    optimizeDeps: {
      include: ['konva', 'vue-konva', 'polygon-clipping', 'chart.js', 'vue-chartjs', 'papaparse'],
    },
  },
  typescript: {
    strict: true,
  },
})
