// Backdrop uploads: checked by content (not name or declared type), 10 MB at most, served only to people who
// may see the yard.
import { describe, it, expect, beforeAll } from 'vitest'
import mysql from 'mysql2/promise'
import { Client, newHomeowner } from '../support/http'
import { TINY_PNG, pngForm } from './access/editor'

async function addMember(yardId: number, userId: number, role: 'viewer' | 'editor') {
  const db = await mysql.createConnection(process.env.DATABASE_URL!)
  try { await db.execute('INSERT INTO yard_members (yard_id, user_id, role) VALUES (?, ?, ?)', [yardId, userId, role]) } finally { await db.end() }
}

let owner: Client
let yardId: number
beforeAll(async () => {
  owner = (await newHomeowner('uploads')).client
  yardId = (await owner.post('/api/yards', { name: 'Upload yard', region: 'US-OH' })).body.id
})

describe('backdrop uploads', () => {
  it('stores a PNG and serves the same bytes with its type', async () => {
    const r = await owner.post(`/api/yards/${yardId}/backdrop`, pngForm())
    expect(r.status).toBe(201)
    expect(r.body.contentType).toBe('image/png')
    const res = await fetch(`${process.env.WW_BASE_URL}${r.body.url}`, { headers: { cookie: await cookieOf(owner) } })
    expect(res.status).toBe(200)
    expect(res.headers.get('content-type')).toBe('image/png')
    expect(new Uint8Array(await res.arrayBuffer())).toEqual(TINY_PNG)
  })

  it('accepts JPEG and WebP by their signatures, whatever the file is called', async () => {
    // JPEG SOI + APP0 marker; WebP RIFF container with the WEBP form type (signatures per the JPEG/JFIF and RIFF specs)
    const jpeg = Uint8Array.from([0xff, 0xd8, 0xff, 0xe0, 0x00, 0x10, 0x4a, 0x46, 0x49, 0x46, 0x00, 0x01])
    const webp = Uint8Array.from([0x52, 0x49, 0x46, 0x46, 0x1a, 0, 0, 0, 0x57, 0x45, 0x42, 0x50, 0x56, 0x50, 0x38, 0x4c])
    const a = await owner.post(`/api/yards/${yardId}/backdrop`, pngForm(jpeg, 'scan.dat', 'application/octet-stream'))
    const b = await owner.post(`/api/yards/${yardId}/backdrop`, pngForm(webp, 'photo.png', 'image/png'))
    expect([a.status, a.body.contentType]).toEqual([201, 'image/jpeg'])
    expect([b.status, b.body.contentType]).toEqual([201, 'image/webp'])
  })

  it('refuses a renamed non-image with a message naming the field', async () => {
    const r = await owner.post(`/api/yards/${yardId}/backdrop`, pngForm(new TextEncoder().encode('<svg xmlns="http://www.w3.org/2000/svg"/>'), 'plan.png', 'image/png'))
    expect(r.status).toBe(400)
    expect(r.body.message).toMatch(/not a PNG, JPEG or WebP image/)
    expect(r.body.data.fields.file).toMatch(/not a PNG/)
  })

  it('refuses more than 10 MB', async () => {
    const big = new Uint8Array(10 * 1024 * 1024 + 1)
    big.set(TINY_PNG.subarray(0, 8))
    const r = await owner.post(`/api/yards/${yardId}/backdrop`, pngForm(big))
    expect(r.status).toBe(413)
    expect(r.body.message).toMatch(/10 MB/)
  })

  it('refuses a request without a file', async () => {
    const form = new FormData()
    form.append('note', 'no file here')
    const r = await owner.post(`/api/yards/${yardId}/backdrop`, form)
    expect(r.status).toBe(400)
    expect(r.body.data.fields.file).toBeTruthy()
  })

  it('lets a viewer see the image but not upload; an upload id is not reachable through another yard', async () => {
    const up = await owner.post(`/api/yards/${yardId}/backdrop`, pngForm())
    const viewer = await newHomeowner('viewer')
    await addMember(yardId, viewer.user.id, 'viewer')
    expect((await viewer.client.get(`/api/yards/${yardId}/backdrop/${up.body.uploadId}`)).status).toBe(200)
    expect((await viewer.client.post(`/api/yards/${yardId}/backdrop`, pngForm())).status).toBe(403)
    const editor = await newHomeowner('editor')
    await addMember(yardId, editor.user.id, 'editor')
    expect((await editor.client.post(`/api/yards/${yardId}/backdrop`, pngForm())).status).toBe(201)
    const otherYard = (await viewer.client.post('/api/yards', { name: 'Viewer yard', region: 'US-OH' })).body.id
    expect((await viewer.client.get(`/api/yards/${otherYard}/backdrop/${up.body.uploadId}`)).status).toBe(404)
  })
})

async function cookieOf(c: Client): Promise<string> {
  return (c as unknown as { cookies: Map<string, string> }).cookies.size
    ? [...(c as unknown as { cookies: Map<string, string> }).cookies].map(([k, v]) => `${k}=${v}`).join('; ')
    : ''
}
