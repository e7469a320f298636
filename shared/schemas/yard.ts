import { z } from 'zod'
import { regionCode } from './common'
import { yardDocument } from './yard-document'

const yardName = z.string().trim().min(1, 'Give the yard a name').max(120)

export const createYardBody = z.object({
  name: yardName,
  region: regionCode,
  document: yardDocument.optional(),
})

export const updateYardBody = z.object({
  version: z.number().int().positive(),
  name: yardName.optional(),
  document: yardDocument.optional(),
})

export type CreateYardBody = z.infer<typeof createYardBody>
export type UpdateYardBody = z.infer<typeof updateYardBody>
