// The device's IndexedDB (Dexie). Sites, cameras and tasks are cached API records, so the app
// works with no network. Every version() stays in this file: add a new one for each change.
import Dexie, { type EntityTable } from 'dexie'
import type { Camera } from '@shared/schemas/cameras'
import type { Task } from '@shared/schemas/catalog'
import type { Site } from '@shared/schemas/sites'

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

  constructor(name = 'sharpfield') {
    super(name)
    this.version(1).stores({
      sites: 'id, name',
      cameras: 'id, siteId, state, nextDueAt, assetTag',
      tasks: 'id',
      meta: 'key',
    })
  }
}

export const db = new SharpfieldDb()
