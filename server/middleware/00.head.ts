/**
 * HEAD for every GET route: the request is routed as GET, and Node's response for a HEAD
 * request sends the headers only (its body is dropped by `http.ServerResponse`). So read tokens
 * may use GET and HEAD everywhere, as docs/api.md says.
 */
export default defineEventHandler((event) => {
  if (event.node.req.method !== 'HEAD') return
  event.node.req.method = 'GET'
  // h3 caches the method on first read
  ;(event as unknown as { _method?: string })._method = 'GET'
})
