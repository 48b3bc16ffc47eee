// Migrations run once at start; Nitro does not await plugins, so requests wait on dbReady().
import { migrate } from 'drizzle-orm/libsql/migrator'
import { existsSync } from 'node:fs'
import { resolve } from 'node:path'

export default defineNitroPlugin(() => {
  const configured = useRuntimeConfig().migrationsDir as string
  const folder = existsSync(configured) ? configured : resolve(process.cwd(), 'db/migrations')
  const ready = (async () => {
    await configureConnection(useClient())
    await migrate(useDB(), { migrationsFolder: folder })
    if (process.env.POLEWRIGHT_SEED) {
      await seedDemo()
      if (process.env.POLEWRIGHT_SEED === 'only') {
        console.log('[seed] demo data is in place')
        process.exit(0)
      }
    }
  })()
  ready.catch((error) => {
    console.error('[db] migration failed:', error)
    process.exit(1)
  })
  setDbReady(ready)
})
