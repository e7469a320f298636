// A fake of the hosted payment service for development and tests, on loopback only. It answers the API calls the
// app makes through the official SDK (Checkout Sessions create/retrieve/expire, refunds) with the same object
// shapes and error format, serves a hosted checkout page (card 4242 4242 4242 4242 succeeds, 4000 0000 0000 0002
// is declined), redirects to the success/cancel URLs, sends signed webhooks (the SDK's own test signature
// helper) with retries, and keeps a record of everything for inspection at /_fake/log.
import { createServer } from 'node:http'
import { randomBytes } from 'node:crypto'
import { existsSync, readFileSync, writeFileSync, mkdirSync } from 'node:fs'
import { dirname } from 'node:path'
import Stripe from 'stripe'

const port = Number(process.env.FAKE_PAYMENTS_PORT || 12111)
const secretKey = process.env.FAKE_PAYMENTS_SECRET_KEY || 'sk_test_wildward_fake'
const webhookSecret = process.env.FAKE_PAYMENTS_WEBHOOK_SECRET || 'whsec_wildward_fake'
const webhookUrl = process.env.FAKE_PAYMENTS_WEBHOOK_URL || ''
const store = process.env.FAKE_PAYMENTS_STORE || ''
const retryBaseMs = Number(process.env.FAKE_PAYMENTS_RETRY_MS || 1000)
const MAX_ATTEMPTS = 6
const API_VERSION = Stripe.API_VERSION ?? '2025-01-01'
const publicUrl = `http://127.0.0.1:${port}`
const signer = new Stripe(secretKey)

export const TEST_CARDS = { '4242424242424242': 'succeeds', '4000000000000002': 'card_declined', '4000000000009995': 'insufficient_funds' }

let state = { sessions: {}, refunds: {}, events: [], requests: [] }
if (store && existsSync(store)) {
  try { state = { ...state, ...JSON.parse(readFileSync(store, 'utf8')) } } catch {}
}
function save() {
  if (!store) return
  mkdirSync(dirname(store), { recursive: true })
  writeFileSync(store, JSON.stringify(state))
}
const newId = (prefix) => `${prefix}_test_${randomBytes(12).toString('hex')}`
const now = () => Math.floor(Date.now() / 1000)

// ---------------------------------------------------------------------------------------------------------------
// Form bodies as the SDK encodes them: a[b][0][c]=v

function parseForm(text) {
  const out = {}
  for (const [rawKey, value] of new URLSearchParams(text)) {
    const path = rawKey.replace(/\]/g, '').split('[')
    let node = out
    path.forEach((part, i) => {
      const last = i === path.length - 1
      const nextIsIndex = !last && /^\d+$/.test(path[i + 1])
      if (last) node[part] = value
      else node = node[part] ??= nextIsIndex ? [] : {}
    })
  }
  return out
}

function apiError(res, status, type, message, extra = {}) {
  send(res, status, { error: { type, message, ...extra } })
}
function send(res, status, body) {
  res.writeHead(status, { 'content-type': 'application/json', 'request-id': newId('req') })
  res.end(JSON.stringify(body))
}
function readBody(req) {
  return new Promise((resolve, reject) => {
    const chunks = []
    req.on('data', (c) => chunks.push(c))
    req.on('end', () => resolve(Buffer.concat(chunks).toString('utf8')))
    req.on('error', reject)
  })
}

// ---------------------------------------------------------------------------------------------------------------
// Events and webhook delivery

function emit(type, object) {
  const event = {
    id: newId('evt'), object: 'event', api_version: API_VERSION, created: now(), livemode: false, pending_webhooks: webhookUrl ? 1 : 0,
    request: { id: null, idempotency_key: null }, type, data: { object: structuredClone(object) }, deliveries: [],
  }
  state.events.push(event)
  save()
  deliver(event, 1)
  return event
}

async function deliver(event, attempt) {
  if (!webhookUrl) return
  const { deliveries, ...body } = event
  const payload = JSON.stringify(body)
  const header = signer.webhooks.generateTestHeaderString({ payload, secret: webhookSecret })
  let status = 0
  let error = null
  try {
    const r = await fetch(webhookUrl, { method: 'POST', headers: { 'content-type': 'application/json', 'stripe-signature': header }, body: payload, signal: AbortSignal.timeout(10_000) })
    status = r.status
    await r.text()
  } catch (e) {
    error = e.message
  }
  event.deliveries.push({ attempt, at: new Date().toISOString(), status, error })
  save()
  if ((status < 200 || status >= 300) && attempt < MAX_ATTEMPTS) {
    setTimeout(() => deliver(event, attempt + 1), retryBaseMs * 2 ** (attempt - 1)).unref()
  }
}

// ---------------------------------------------------------------------------------------------------------------
// Checkout Sessions

function createSession(p) {
  const items = Array.isArray(p.line_items) ? p.line_items : []
  if (!items.length) return { error: ['line_items', 'You must provide at least one line item.'] }
  if (!p.success_url) return { error: ['success_url', 'Missing required param: success_url.'] }
  if (p.mode !== 'payment') return { error: ['mode', 'This fake only supports mode=payment.'] }
  let amount = 0
  let currency = null
  const lineItems = []
  for (const [i, li] of items.entries()) {
    const pd = li.price_data
    const unit = Number(pd?.unit_amount)
    const qty = Number(li.quantity ?? 1)
    if (!pd || !Number.isInteger(unit) || unit < 0) return { error: [`line_items[${i}][price_data][unit_amount]`, 'Invalid integer: unit_amount.'] }
    if (!Number.isInteger(qty) || qty < 1) return { error: [`line_items[${i}][quantity]`, 'Invalid integer: quantity.'] }
    if (currency && pd.currency !== currency) return { error: [`line_items[${i}][price_data][currency]`, 'All line items must use the same currency.'] }
    currency = pd.currency
    amount += unit * qty
    lineItems.push({ name: pd.product_data?.name ?? 'Item', unit_amount: unit, quantity: qty })
  }
  const id = newId('cs')
  const expiresAt = p.expires_at ? Number(p.expires_at) : now() + 24 * 3600
  const session = {
    id, object: 'checkout.session', mode: 'payment', status: 'open', payment_status: 'unpaid', amount_subtotal: amount, amount_total: amount,
    currency, client_reference_id: p.client_reference_id ?? null, customer_email: p.customer_email ?? null, metadata: p.metadata ?? {},
    success_url: p.success_url, cancel_url: p.cancel_url ?? null, expires_at: expiresAt, created: now(), livemode: false,
    payment_intent: null, url: `${publicUrl}/pay/${id}`,
    // kept for the hosted page; not part of the real object
    _lines: lineItems, _declines: 0,
  }
  state.sessions[id] = session
  save()
  return { session }
}

const publicSession = ({ _lines, _declines, _charge, ...s }) => s

function expireSession(s) {
  s.status = 'expired'
  s.url = null
  save()
  emit('checkout.session.expired', publicSession(s))
}

setInterval(() => {
  for (const s of Object.values(state.sessions)) if (s.status === 'open' && s.expires_at <= now()) expireSession(s)
}, 2000).unref()

// ---------------------------------------------------------------------------------------------------------------
// The hosted checkout page

const esc = (s) => String(s ?? '').replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' }[c]))
const money = (minor, currency) => `${(currency ?? '').toUpperCase()} ${(minor / 100).toFixed(2)}`

function page(s, message = '') {
  const lines = s._lines.map((l) => `<tr><td>${esc(l.name)}</td><td>${l.quantity}</td><td>${money(l.unit_amount * l.quantity, s.currency)}</td></tr>`).join('')
  const open = s.status === 'open'
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<title>Test checkout</title><style>
body{font-family:system-ui,sans-serif;max-width:32rem;margin:2rem auto;padding:0 1rem;color:#222}
.banner{background:#fff3cd;border:1px solid #e0c36a;padding:.5rem .75rem;border-radius:.4rem;font-size:.9rem}
table{width:100%;border-collapse:collapse;margin:1rem 0}td{border-bottom:1px solid #ddd;padding:.35rem 0}
label{display:block;margin:.6rem 0 .2rem;font-weight:600}input{width:100%;padding:.5rem;font-size:1rem;box-sizing:border-box}
button{margin-top:1rem;padding:.6rem 1.2rem;font-size:1rem;font-weight:700;background:#2f5d50;color:#fff;border:0;border-radius:.4rem}
.error{background:#fde2e1;border:1px solid #c0392b;color:#8e1b10;padding:.6rem .75rem;border-radius:.4rem;font-weight:700}
</style></head><body>
<p class="banner">Test mode: a local stand-in for the payment service. No real money moves. Card 4242 4242 4242 4242 is accepted; 4000 0000 0000 0002 is declined.</p>
<h1>Pay ${money(s.amount_total, s.currency)}</h1>
<table><tbody>${lines}</tbody></table>
${message ? `<p class="error" role="alert" data-test="pay-error">${esc(message)}</p>` : ''}
${open ? `<form method="post" action="/pay/${s.id}">
<label for="card">Card number</label><input id="card" name="card" inputmode="numeric" autocomplete="cc-number" required>
<label for="expiry">Expiry (MM/YY)</label><input id="expiry" name="expiry" value="12/34" required>
<label for="cvc">CVC</label><input id="cvc" name="cvc" value="123" required>
<button type="submit" data-test="pay">Pay</button>
</form>${s.cancel_url ? `<p><a href="/pay/${s.id}/cancel">Cancel and go back</a></p>` : ''}` : `<p>This checkout is ${esc(s.status)}.</p>`}
</body></html>`
}

function html(res, status, body) {
  res.writeHead(status, { 'content-type': 'text/html; charset=utf-8' })
  res.end(body)
}
function redirect(res, url) {
  res.writeHead(303, { location: url })
  res.end()
}

function pay(s, card) {
  const number = String(card ?? '').replace(/\D/g, '')
  const outcome = TEST_CARDS[number]
  if (!outcome) return 'Your card number is incorrect.'
  if (outcome === 'card_declined') { s._declines++; save(); return 'Your card was declined.' }
  if (outcome === 'insufficient_funds') { s._declines++; save(); return 'Your card has insufficient funds.' }
  s.status = 'complete'
  s.payment_status = 'paid'
  s.payment_intent = newId('pi')
  s.url = null
  s._charge = newId('ch')
  save()
  emit('checkout.session.completed', publicSession(s))
  return null
}

// ---------------------------------------------------------------------------------------------------------------

const server = createServer(async (req, res) => {
  const url = new URL(req.url, publicUrl)
  const parts = url.pathname.split('/').filter(Boolean)
  try {
    // inspection and test controls
    if (parts[0] === '_fake') {
      if (req.method === 'GET' && parts[1] === 'log') {
        const events = state.events.map((e) => ({ id: e.id, type: e.type, objectId: e.data.object.id, created: e.created, deliveries: e.deliveries }))
        return send(res, 200, { sessions: Object.values(state.sessions).map(publicSession), refunds: Object.values(state.refunds), events, requests: state.requests.slice(-500) })
      }
      if (req.method === 'POST' && parts[1] === 'sessions' && parts[3] === 'expire') {
        const s = state.sessions[parts[2]]
        if (!s) return apiError(res, 404, 'invalid_request_error', 'No such checkout.session', { code: 'resource_missing' })
        if (s.status !== 'open') return apiError(res, 400, 'invalid_request_error', `This session is ${s.status}`)
        expireSession(s)
        return send(res, 200, publicSession(s))
      }
      if (req.method === 'POST' && parts[1] === 'events' && parts[3] === 'redeliver') {
        const e = state.events.find((x) => x.id === parts[2])
        if (!e) return apiError(res, 404, 'invalid_request_error', 'No such event', { code: 'resource_missing' })
        await deliver(e, e.deliveries.length + 1)
        return send(res, 200, { id: e.id, deliveries: e.deliveries })
      }
      return apiError(res, 404, 'invalid_request_error', 'Unrecognized request URL')
    }

    // the hosted checkout page
    if (parts[0] === 'pay' && parts[1]) {
      const s = state.sessions[parts[1]]
      if (!s) return html(res, 404, '<!doctype html><title>Not found</title><p>No such checkout.</p>')
      if (parts[2] === 'cancel') return s.cancel_url ? redirect(res, s.cancel_url.replace('{CHECKOUT_SESSION_ID}', s.id)) : html(res, 404, '')
      if (req.method === 'GET') return html(res, 200, page(s))
      if (req.method === 'POST') {
        if (s.status !== 'open') return html(res, 409, page(s, `This checkout is ${s.status}.`))
        const form = new URLSearchParams(await readBody(req))
        const failure = pay(s, form.get('card'))
        if (failure) return html(res, 402, page(s, failure))
        return redirect(res, s.success_url.replace('{CHECKOUT_SESSION_ID}', s.id))
      }
    }

    // the API
    if (parts[0] !== 'v1') return apiError(res, 404, 'invalid_request_error', 'Unrecognized request URL')
    const auth = req.headers.authorization ?? ''
    if (auth !== `Bearer ${secretKey}`) return apiError(res, 401, 'invalid_request_error', 'Invalid API Key provided')
    const body = req.method === 'POST' ? parseForm(await readBody(req)) : {}
    state.requests.push({ at: new Date().toISOString(), method: req.method, path: url.pathname, idempotencyKey: req.headers['idempotency-key'] ?? null })

    if (parts[1] === 'checkout' && parts[2] === 'sessions') {
      if (req.method === 'POST' && parts.length === 3) {
        const r = createSession(body)
        if (r.error) return apiError(res, 400, 'invalid_request_error', r.error[1], { param: r.error[0] })
        return send(res, 200, publicSession(r.session))
      }
      const s = state.sessions[parts[3]]
      if (!s) return apiError(res, 404, 'invalid_request_error', `No such checkout.session: '${parts[3]}'`, { code: 'resource_missing', param: 'session' })
      if (req.method === 'GET' && parts.length === 4) return send(res, 200, publicSession(s))
      if (req.method === 'POST' && parts[4] === 'expire') {
        if (s.status !== 'open') return apiError(res, 400, 'invalid_request_error', `Only Checkout Sessions with a status of \`open\` can be expired. This session has a status of \`${s.status}\`.`)
        expireSession(s)
        return send(res, 200, publicSession(s))
      }
    }

    if (parts[1] === 'refunds' && req.method === 'POST' && parts.length === 2) {
      const s = Object.values(state.sessions).find((x) => x.payment_intent && x.payment_intent === body.payment_intent)
      if (!s) return apiError(res, 404, 'invalid_request_error', `No such payment_intent: '${body.payment_intent ?? ''}'`, { code: 'resource_missing', param: 'payment_intent' })
      const refunded = Object.values(state.refunds).filter((r) => r.payment_intent === s.payment_intent).reduce((a, r) => a + r.amount, 0)
      const amount = body.amount === undefined ? s.amount_total - refunded : Number(body.amount)
      if (refunded >= s.amount_total) return apiError(res, 400, 'invalid_request_error', `Charge ${s._charge} has already been refunded.`, { code: 'charge_already_refunded' })
      if (!Number.isInteger(amount) || amount < 1 || amount + refunded > s.amount_total) return apiError(res, 400, 'invalid_request_error', 'Refund amount is greater than the unrefunded amount.', { param: 'amount', code: 'amount_too_large' })
      const refund = { id: newId('re'), object: 'refund', amount, currency: s.currency, payment_intent: s.payment_intent, charge: s._charge, status: 'succeeded', reason: body.reason ?? null, metadata: body.metadata ?? {}, created: now() }
      state.refunds[refund.id] = refund
      save()
      const total = refunded + amount
      emit('charge.refunded', {
        id: s._charge, object: 'charge', amount: s.amount_total, amount_captured: s.amount_total, amount_refunded: total, currency: s.currency,
        payment_intent: s.payment_intent, paid: true, refunded: total >= s.amount_total, status: 'succeeded', metadata: s.metadata, created: now(),
      })
      return send(res, 200, refund)
    }
    if (parts[1] === 'refunds' && req.method === 'GET' && parts[2]) {
      const r = state.refunds[parts[2]]
      return r ? send(res, 200, r) : apiError(res, 404, 'invalid_request_error', `No such refund: '${parts[2]}'`, { code: 'resource_missing' })
    }
    return apiError(res, 404, 'invalid_request_error', `Unrecognized request URL (${req.method}: ${url.pathname}).`)
  } catch (e) {
    apiError(res, 500, 'api_error', e.message)
  }
})

server.listen(port, '127.0.0.1', () => {
  console.log(`[fake-payments] API and hosted checkout on ${publicUrl}${webhookUrl ? `, webhooks to ${webhookUrl}` : ''}`)
})
for (const sig of ['SIGTERM', 'SIGINT']) process.on(sig, () => { server.close(); process.exit(0) })
