import { z } from 'zod'
import { email } from './common'
import { ROLE_NAMES } from '../types/roles'

export const password = z.string().min(10, 'Use at least 10 characters').max(200)

export const loginBody = z.object({
  email,
  password: z.string().min(1, 'Enter your password').max(200),
})

export const registerBody = z.object({
  email,
  name: z.string().trim().min(1, 'Enter your name').max(120),
  password,
  // set when registering from an invitation link
  invite: z.string().max(128).optional(),
})

export const forgotPasswordBody = z.object({ email })

export const resetPasswordBody = z.object({
  token: z.string().min(20).max(128),
  password,
})

export const changePasswordBody = z.object({
  currentPassword: z.string().min(1, 'Enter your current password').max(200),
  newPassword: password,
})

export const changeRoleBody = z.object({ role: z.enum(ROLE_NAMES) })

export const usersQuery = z.object({
  q: z.string().trim().max(120).optional(),
  page: z.coerce.number().int().min(1).default(1),
})
