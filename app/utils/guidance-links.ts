import type { ApproachId, WallTreatment } from '#shared/rules'

/** The guidance article of an approach or a wall treatment (content/guidance/<slug>.md). */
export function guidancePath(slug: ApproachId | WallTreatment): string {
  return `/guidance/${slug}`
}
