import { defineConfig } from 'drizzle-kit'
import { mkdirSync } from 'node:fs'

const url = process.env.DATABASE_URL || 'file:data/polewright.db'
// SQLite does not create the folder of its file.
if (url.startsWith('file:')) mkdirSync(url.slice(5).replace(/[^/]*$/, '') || '.', { recursive: true })

export default defineConfig({
  dialect: 'sqlite',
  schema: './db/schema.ts',
  out: './db/migrations',
  dbCredentials: { url },
})
