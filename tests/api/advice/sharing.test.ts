// Sharing a yard by e-mail invite: existing and new accounts, the wrong account, revoking.
import { describe, it, expect } from 'vitest'
import { Client, newHomeowner, waitForMail } from '../../support/http'

const tokenIn = (text: string) => /(?:\/invites\/|invite=)([A-Za-z0-9_-]{20,})/.exec(text)?.[1]

describe('sharing a yard by invite', () => {
  it('invites an existing account as viewer, who accepts, can look but not change, and loses access on revoke', async () => {
    const owner = await newHomeowner('share-owner')
    const friend = await newHomeowner('share-friend')
    const { id: yardId } = (await owner.client.post('/api/yards', { name: 'Shared plot', region: 'US-OH' })).body
    const invited = await owner.client.post(`/api/yards/${yardId}/invites`, { email: friend.email, role: 'viewer' })
    expect(invited.status).toBe(201)
    const [mail] = await waitForMail(friend.email)
    expect(mail!.subject).toMatch(/shared a yard/)
    const token = tokenIn(mail!.text)!
    expect(mail!.text).toContain(`/invites/${token}`)

    expect((await friend.client.get(`/api/yards/${yardId}`)).status).toBe(404)
    const shown = await new Client().get(`/api/invites/${token}`)
    expect(shown.body).toMatchObject({ yardName: 'Shared plot', role: 'viewer', status: 'pending' })
    expect((await friend.client.post(`/api/invites/${token}/accept`)).body).toEqual({ yardId })

    const seen = await friend.client.get(`/api/yards/${yardId}`)
    expect(seen.status).toBe(200)
    expect(seen.body.access).toBe('view')
    expect((await friend.client.put(`/api/yards/${yardId}`, { version: 1, name: 'Mine now' })).status).toBe(403)
    expect((await friend.client.get('/api/yards')).body.items.map((y: { id: number }) => y.id)).toContain(yardId)

    const shares = (await owner.client.get(`/api/yards/${yardId}/invites`)).body
    expect(shares.invites).toEqual([expect.objectContaining({ email: friend.email, status: 'accepted' })])
    expect(shares.members).toEqual([expect.objectContaining({ userId: friend.user.id, role: 'viewer' })])

    expect((await owner.client.delete(`/api/yards/${yardId}/invites/${invited.body.id}`)).status).toBe(204)
    expect((await friend.client.get(`/api/yards/${yardId}`)).status).toBe(404)
    // the used link cannot bring the access back
    expect((await friend.client.post(`/api/invites/${token}/accept`)).status).toBe(404)
    expect((await owner.client.get(`/api/yards/${yardId}/invites`)).body).toEqual({ invites: [], members: [] })
  })

  it('lets someone without an account register from the link as an editor; another account cannot use it', async () => {
    const owner = await newHomeowner('share-owner2')
    const { id: yardId } = (await owner.client.post('/api/yards', { name: 'Helper wanted', region: 'US-OH' })).body
    const email = `new-helper-${Date.now()}@example.test`
    expect((await owner.client.post(`/api/yards/${yardId}/invites`, { email, role: 'editor' })).status).toBe(201)
    const [mail] = await waitForMail(email)
    expect(mail!.text).toMatch(/\/register\?invite=/)
    const token = tokenIn(mail!.text)!

    const stranger = await newHomeowner('share-stranger')
    const refused = await stranger.client.post(`/api/invites/${token}/accept`)
    expect(refused.status).toBe(403)
    expect(refused.body.message).toContain(email)

    const helper = new Client()
    const registered = await helper.post('/api/auth/register', { email, name: 'New Helper', password: 'a-long-test-password', invite: token })
    expect(registered.status).toBe(201)
    const yard = await helper.get(`/api/yards/${yardId}`)
    expect(yard.body.access).toBe('edit')
    expect((await helper.put(`/api/yards/${yardId}`, { version: 1, name: 'Helped' })).status).toBe(200)
    expect((await new Client().get(`/api/invites/${token}`)).body.status).toBe('accepted')

    // stopping sharing with a member works without the invite id too
    expect((await owner.client.delete(`/api/yards/${yardId}/members/${registered.body.user.id}`)).status).toBe(204)
    expect((await helper.get(`/api/yards/${yardId}`)).status).toBe(404)
  })

  it('names the bad field and refuses to invite the owner', async () => {
    const owner = await newHomeowner('share-owner3')
    const { id: yardId } = (await owner.client.post('/api/yards', { name: 'Plot', region: 'US-OH' })).body
    const bad = await owner.client.post(`/api/yards/${yardId}/invites`, { email: 'not-an-address', role: 'viewer' })
    expect(bad.status).toBe(400)
    expect(bad.body.data.fields.email).toBeTruthy()
    const self = await owner.client.post(`/api/yards/${yardId}/invites`, { email: owner.email, role: 'editor' })
    expect(self.status).toBe(400)
    expect(self.body.data.fields.email).toBeTruthy()
  })
})
