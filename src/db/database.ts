// The device's IndexedDB (Dexie). Sites, cameras and tasks are cached API records, so the app
// works with no network. Every version() stays in this file: add a new one for each change.
import Dexie, { type EntityTable } from 'dexie'
import type { Camera } from '@shared/schemas/cameras'
import type { Task } from '@shared/schemas/catalog'
import type { Site } from '@shared/schemas/sites'
import {
  CHECK_STORES,
  type CameraHistoryRecord,
  type CameraModelRecord,
  type CheckRecord,
  type CropRecord,
  type FrameRecord,
  type MeasurementRecord,
} from './checks'
import {
  SYNC_STORES,
  type OutboxRecord,
  type SyncRound,
  type UploadRecord,
  type WorkOrder,
} from './syncTables'

export interface MetaRecord {
  key: string
  value: string
}

export const META_KEYS = {
  /** ISO time of the last complete download of sites, cameras and tasks. */
  catalogRefreshedAt: 'catalogRefreshedAt',
  /** Id of the user whose data the cache holds. */
  catalogUserId: 'catalogUserId',
} as const

export class SharpfieldDb extends Dexie {
  sites!: EntityTable<Site, 'id'>
  cameras!: EntityTable<Camera, 'id'>
  tasks!: EntityTable<Task, 'id'>
  meta!: EntityTable<MetaRecord, 'key'>
  checks!: EntityTable<CheckRecord, 'id'>
  measurements!: EntityTable<MeasurementRecord, 'id'>
  frames!: EntityTable<FrameRecord, 'checkId'>
  crops!: EntityTable<CropRecord, 'id'>
  cameraHistory!: EntityTable<CameraHistoryRecord, 'cameraId'>
  cameraModels!: EntityTable<CameraModelRecord, 'id'>
  outbox!: EntityTable<OutboxRecord, 'seq'>
  uploads!: EntityTable<UploadRecord, 'id'>
  rounds!: EntityTable<SyncRound, 'id'>
  workOrders!: EntityTable<WorkOrder, 'id'>

  constructor(name = 'sharpfield') {
    super(name)
    this.version(1).stores({
      sites: 'id, name',
      cameras: 'id, siteId, state, nextDueAt, assetTag',
      tasks: 'id',
      meta: 'key',
    })
    // Checks made on the device, their regions, frames and crops; server history; camera models.
    this.version(2).stores(CHECK_STORES)
    // Sync: the outbox, the upload queue, pulled rounds and work orders.
    this.version(3).stores(SYNC_STORES)
  }
}

export const db = new SharpfieldDb()
