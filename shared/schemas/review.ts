// The reviewer's queue, a page at a time, the longest-waiting first.
import type { z } from 'zod'
import { pageQuerySchema } from './pagination'

export const reviewQueueQuerySchema = pageQuerySchema(100, 25)
export type ReviewQueueQuery = z.infer<typeof reviewQueueQuerySchema>
