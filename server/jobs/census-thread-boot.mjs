// Entry of a census thread (census-threads.ts): registers tsx in this thread, then loads the
// TypeScript thread (module hooks are per thread, so the parent's loader does not reach here).
import { register } from 'tsx/esm/api'

register()
await import('./census-thread.ts')
