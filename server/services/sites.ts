import { asc, count, eq } from 'drizzle-orm'
import type { Site } from '../../shared/schemas/sites'
import type { Db } from '../db/client'
import { cameras, sites } from '../db/schema'

export function createSiteService(db: Db) {
  return {
    async list(): Promise<Site[]> {
      const rows = await db
        .select({
          id: sites.id,
          name: sites.name,
          address: sites.address,
          timeZone: sites.timeZone,
          updatedAt: sites.updatedAt,
          cameraCount: count(cameras.id),
        })
        .from(sites)
        .leftJoin(cameras, eq(cameras.siteId, sites.id))
        .groupBy(sites.id)
        .orderBy(asc(sites.name))
      return rows.map((r) => ({
        ...r,
        cameraCount: Number(r.cameraCount),
        updatedAt: r.updatedAt.toISOString(),
      }))
    },
  }
}

export type SiteService = ReturnType<typeof createSiteService>
