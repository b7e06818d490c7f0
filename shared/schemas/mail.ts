import { z } from 'zod'

export const MAIL_STATUSES = ['pending', 'sent', 'failed'] as const
export type MailStatus = (typeof MAIL_STATUSES)[number]

export const mailListQuerySchema = z.object({
  status: z.enum(MAIL_STATUSES, { errorMap: () => ({ message: `Status must be one of ${MAIL_STATUSES.join(', ')}` }) }).optional(),
  page: z.coerce.number({ invalid_type_error: 'Page must be a number' }).int('Page must be a whole number').min(1, 'Page starts at 1').max(100_000, 'Page is at most 100000').default(1),
})
export type MailListQuery = z.infer<typeof mailListQuerySchema>
