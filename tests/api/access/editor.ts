import type { AccessRow } from './types'

// a 1×1 PNG (the smallest valid file: signature, IHDR, IDAT, IEND)
export const TINY_PNG = Uint8Array.from(Buffer.from('iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mNkYPhfDwAChwGA60e6kgAAAABJRU5ErkJggg==', 'base64'))

export function pngForm(bytes: Uint8Array = TINY_PNG, name = 'plan.png', type = 'image/png') {
  const form = new FormData()
  form.append('file', new Blob([bytes], { type }), name)
  return form
}

let uploaded: { yardId: number; uploadId: string } | null = null

export const rows: AccessRow[] = [
  {
    file: 'yards/[id]/backdrop.post.ts', method: 'POST',
    request: (c) => ({ path: `/api/yards/${c.yardId}/backdrop`, body: pngForm() }),
    expect: { anonymous: 401, owner: 201, otherHomeowner: 404, advisor: 404, coordinator: 404 },
  },
  {
    file: 'yards/[id]/backdrop/[uploadId].get.ts', method: 'GET',
    request: async (c) => {
      if (!uploaded || uploaded.yardId !== c.yardId) {
        const r = await c.owner.post(`/api/yards/${c.yardId}/backdrop`, pngForm())
        uploaded = { yardId: c.yardId, uploadId: r.body.uploadId }
      }
      return { path: `/api/yards/${c.yardId}/backdrop/${uploaded.uploadId}` }
    },
    expect: { anonymous: 401, owner: 200, otherHomeowner: 404, advisor: 404, coordinator: 404 },
  },
]
