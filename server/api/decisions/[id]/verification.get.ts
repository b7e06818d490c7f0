import { idParamSchema } from '#shared/schemas/common'
import { MAX_UPLOAD_BYTES } from '#shared/verification'

// The decision's verification section: wall checks, grid studies, run records, and what the
// signed-in user may do with them.
export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, zodValidator(idParamSchema))
  const { user, decision, isMember } = await requireVerificationAccess(event, id, 'read')
  const signedOff = decision.status === 'approved' || decision.status === 'overridden' || decision.status === 'superseded'
  return {
    status: decision.status,
    ...(signedOff ? await verificationSection(id) : { signedOff: null, passFraction: await currentPassFraction(), wallChecks: [], gridStudies: [], runs: [] }),
    maxUploadBytes: MAX_UPLOAD_BYTES,
    userId: user.id,
    permissions: verificationPermissions(user, decision, isMember),
  }
})
