// Runs before everything else (01.api-auth needs no body): writes from other sites and non-JSON
// write bodies are refused (403/415), oversize bodies are refused before they are read (413), and
// HSTS is added over TLS. See server/utils/http/.
export default defineEventHandler(async (event) => {
  setTransportSecurity(event)
  guardWriteRequest(event)
  await limitRequestBody(event)
})
