// The advice preview's request body, read and validated at the edge like any other. The questionnaire
// sends the same case again and again as the engineer goes back and forth, and a body's validation
// is a pure function of its text, so a body seen before is answered with the case it parsed to
// (JSON parsing and the schema's checks were a tenth of a repeated preview's cost).
import type { H3Event } from 'h3'
import type { CaseInput } from '#shared/rules'
import { adviceRequestSchema } from '#shared/schemas/decisions'
import { versionedCache } from '../cache/versioned'
import { zodValidator } from '../http/validation'

const parsed = versionedCache<CaseInput>(256)

export async function readAdviceCase(event: H3Event): Promise<CaseInput> {
  const raw = await readRawBody(event, 'utf8')
  const held = raw ? parsed.peek('', raw) : undefined
  if (held) return held
  // A body that fails its checks answers 400 here, and is not kept.
  const { caseInput } = await readValidatedBody(event, zodValidator(adviceRequestSchema))
  if (raw) parsed.put('', raw, caseInput)
  return caseInput
}
