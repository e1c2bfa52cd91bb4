import { z } from 'zod'
import { ROLES } from '../domain/enums'

export const emailSchema = z.string().trim().toLowerCase().pipe(z.email({ error: 'Enter a valid e-mail address.' }))

export const passwordSchema = z
  .string()
  .min(10, { error: 'Use at least 10 characters.' })
  .max(200, { error: 'Use at most 200 characters.' })

export const loginSchema = z.object({
  email: emailSchema,
  password: z.string().min(1, { error: 'Enter your password.' }).max(200),
})
export type LoginInput = z.infer<typeof loginSchema>

export const changePasswordSchema = z.object({
  currentPassword: z.string().min(1, { error: 'Enter your current password.' }).max(200),
  newPassword: passwordSchema,
}).refine(v => v.currentPassword !== v.newPassword, {
  path: ['newPassword'],
  error: 'The new password must differ from the current one.',
})
export type ChangePasswordInput = z.infer<typeof changePasswordSchema>

export const createUserSchema = z.object({
  email: emailSchema,
  name: z.string().trim().min(1, { error: 'Enter a name.' }).max(120),
  role: z.enum(ROLES, { error: 'Choose one of: admin, qa, owner, viewer.' }),
  /** Leave out to invite by e-mail (the usual way); a scripted setup may still give a first password. */
  password: passwordSchema.optional(),
})
export type CreateUserInput = z.infer<typeof createUserSchema>

export const updateUserSchema = z.object({
  name: z.string().trim().min(1).max(120).optional(),
  role: z.enum(ROLES, { error: 'Choose one of: admin, qa, owner, viewer.' }).optional(),
  disabled: z.boolean().optional(),
}).refine(v => Object.keys(v).length > 0, { error: 'Nothing to change: send name, role or disabled.' })
export type UpdateUserInput = z.infer<typeof updateUserSchema>

export const idParamSchema = z.object({
  id: z.coerce.number().int().positive({ error: 'The id must be a positive whole number.' }),
})

export const forgotPasswordSchema = z.object({ email: emailSchema })

/** The secret from a set-password link (invitation or reset). */
export const linkTokenSchema = z.object({
  token: z.string().regex(/^[\w-]{20,100}$/, { error: 'This link is incomplete: open it again from the message, whole.' }),
})

export const setPasswordSchema = linkTokenSchema.extend({ password: passwordSchema })
export type SetPasswordInput = z.infer<typeof setPasswordSchema>
