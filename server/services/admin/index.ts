// Administration use cases: users, sites, camera models, task thresholds, cameras, the camera
// CSV import and the audit log.
import type { Db } from '../../db/client'
import { listAudit } from './auditLog'
import { createCameraImport } from './cameraImport'
import { createCameraAdmin } from './cameras'
import { createCatalogAdmin } from './catalog'
import { createUserAdmin } from './users'
import type { AuditQuery } from '../../../shared/schemas/setup'

export function createAdminService(db: Db, now: () => Date) {
  return {
    users: createUserAdmin(db, now),
    catalog: createCatalogAdmin(db),
    cameras: createCameraAdmin(db),
    cameraImport: createCameraImport(db),
    audit: (q: AuditQuery) => listAudit(db, q),
  }
}

export type AdminService = ReturnType<typeof createAdminService>
