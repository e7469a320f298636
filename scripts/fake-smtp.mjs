// A fake SMTP server for development and tests: accepts every message on loopback, keeps it (in memory and in
// a JSON-lines file), and lists the captured mail over HTTP so the app's demo mail page and the tests can read it.
import { SMTPServer } from 'smtp-server'
import { simpleParser } from 'mailparser'
import { createServer } from 'node:http'
import { appendFileSync, existsSync, readFileSync, writeFileSync, mkdirSync } from 'node:fs'
import { dirname } from 'node:path'
import { randomUUID } from 'node:crypto'

const smtpPort = Number(process.env.FAKE_SMTP_PORT || 2525)
const httpPort = Number(process.env.FAKE_SMTP_HTTP_PORT || 2580)
const store = process.env.FAKE_SMTP_STORE || ''
const MAX_KEPT = 5000

let messages = []
if (store && existsSync(store)) {
  messages = readFileSync(store, 'utf8').split('\n').filter(Boolean).map((l) => JSON.parse(l)).slice(-MAX_KEPT)
}
if (store) mkdirSync(dirname(store), { recursive: true })

const smtp = new SMTPServer({
  authOptional: true,
  disabledCommands: ['STARTTLS'],
  banner: 'Wildward fake SMTP',
  onData(stream, session, callback) {
    simpleParser(stream).then((mail) => {
      const message = {
        id: randomUUID(),
        receivedAt: new Date().toISOString(),
        from: mail.from?.text ?? '',
        to: session.envelope.rcptTo.map((r) => r.address),
        subject: mail.subject ?? '',
        text: mail.text ?? '',
        html: typeof mail.html === 'string' ? mail.html : '',
        headers: Object.fromEntries([...mail.headers].filter(([, v]) => typeof v === 'string')),
      }
      messages.push(message)
      if (messages.length > MAX_KEPT) messages = messages.slice(-MAX_KEPT)
      if (store) appendFileSync(store, JSON.stringify(message) + '\n')
      callback()
    }, callback)
  },
})
smtp.on('error', (e) => console.error('[fake-smtp]', e.message))
smtp.listen(smtpPort, '127.0.0.1')

const http = createServer((req, res) => {
  const url = new URL(req.url, 'http://127.0.0.1')
  if (url.pathname === '/messages' && req.method === 'GET') {
    const to = url.searchParams.get('to')?.toLowerCase()
    const list = to ? messages.filter((m) => m.to.some((a) => a.toLowerCase() === to)) : messages
    res.setHeader('content-type', 'application/json')
    return res.end(JSON.stringify([...list].reverse()))
  }
  if (url.pathname === '/messages' && req.method === 'DELETE') {
    messages = []
    if (store) writeFileSync(store, '')
    res.statusCode = 204
    return res.end()
  }
  res.statusCode = 404
  res.end()
})
http.listen(httpPort, '127.0.0.1', () => {
  console.log(`[fake-smtp] SMTP on 127.0.0.1:${smtpPort}, captured mail on http://127.0.0.1:${httpPort}/messages`)
})

for (const sig of ['SIGTERM', 'SIGINT']) process.on(sig, () => { smtp.close(); http.close(); process.exit(0) })
