import { linkTokenSchema } from '../../../shared/schemas/auth'

// Public route: is this set-password link still good? The page asks before showing its form.
export default defineEventHandler(async (event) => {
  const { token } = await validBody(event, linkTokenSchema)
  const { link, user } = await liveLink(useDb(), token)
  return { purpose: link.purpose, email: user.email, name: user.name }
})
