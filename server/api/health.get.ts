// For load balancers and monitoring, without a session: 200 while the database answers, else 503.
export default defineEventHandler(async (event) => {
  const database = await databaseReachable()
  setResponseHeader(event, 'Cache-Control', 'no-store')
  if (!database) {
    setResponseStatus(event, 503, 'Service Unavailable')
    return { status: 'unavailable', database: 'unreachable' }
  }
  return { status: 'ok', database: 'reachable' }
})
