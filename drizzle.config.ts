import { defineConfig } from 'drizzle-kit'

// `npm run db:generate` writes SQL migrations to server/migrations (committed to git).
// They are applied at server start by server/plugins/migrate.ts.
export default defineConfig({
  dialect: 'sqlite',
  schema: './server/db/schema.ts',
  out: './server/migrations',
})
