// The database schema: the source of truth for `npx drizzle-kit generate` (migrations in drizzle/).
// Keys are camelCase, columns snake_case (casing: 'snake_case' in drizzle.config.ts and at runtime).
// Times are UTC (the pool sets the session time zone to +00:00).
import { sql } from 'drizzle-orm'
import {
  bigint,
  boolean,
  char,
  date,
  datetime,
  double,
  index,
  int,
  json,
  mysqlEnum,
  mysqlTable,
  primaryKey,
  smallint,
  mediumtext,
  text,
  uniqueIndex,
  varchar,
} from 'drizzle-orm/mysql-core'
import type { MtfPoint, VerdictReason } from '../../shared/schemas/checks'
import {
  ATTACHMENT_KINDS,
  CAMERA_STATES,
  CHANGE_ACTIONS,
  CHECK_MODES,
  EDGE_ORIENTATIONS,
  MAIL_STATUSES,
  PRIORITIES,
  PSF_MODELS,
  ROLES,
  ROUND_STATUSES,
  SYNC_OP_STATUSES,
  VERDICTS,
  WORK_ORDER_STATUSES,
} from '../../shared/schemas/enums'

const now3 = sql`CURRENT_TIMESTAMP(3)`
const createdAt = () => datetime({ mode: 'date', fsp: 3 }).notNull().default(now3)
const updatedAt = () =>
  datetime({ mode: 'date', fsp: 3 })
    .notNull()
    .default(now3)
    .$onUpdate(() => new Date())
const when = () => datetime({ mode: 'date', fsp: 3 })
const uuid = () => char({ length: 36 })

export const users = mysqlTable('users', {
  id: int().autoincrement().primaryKey(),
  email: varchar({ length: 254 }).notNull().unique(),
  name: varchar({ length: 120 }).notNull(),
  role: mysqlEnum(ROLES).notNull(),
  passwordHash: varchar({ length: 255 }).notNull(),
  active: boolean().notNull().default(true),
  createdAt: createdAt(),
  updatedAt: updatedAt(),
})

export const refreshTokens = mysqlTable(
  'refresh_tokens',
  {
    id: int().autoincrement().primaryKey(),
    userId: int()
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    familyId: uuid().notNull(),
    tokenHash: char({ length: 64 }).notNull().unique(),
    expiresAt: when().notNull(),
    revokedAt: when(),
    replacedBy: int(),
    createdAt: createdAt(),
  },
  (t) => [
    index('refresh_tokens_family_idx').on(t.familyId),
    index('refresh_tokens_user_idx').on(t.userId),
  ],
)

// Failed sign-ins per (account, client address), shared by every server process and replica
// (services/loginAttemptsDb.ts). Rows older than the limiter's window are pruned.
export const loginFailures = mysqlTable(
  'login_failures',
  {
    id: bigint({ mode: 'number', unsigned: true }).autoincrement().primaryKey(),
    // Lower-cased e-mail, '|', client address: at most 254 + 1 + 45 characters.
    attemptKey: varchar({ length: 320 }).notNull(),
    at: when().notNull(),
  },
  (t) => [
    index('login_failures_key_idx').on(t.attemptKey, t.at),
    index('login_failures_at_idx').on(t.at),
  ],
)

export const sites = mysqlTable('sites', {
  id: int().autoincrement().primaryKey(),
  name: varchar({ length: 120 }).notNull().unique(),
  address: varchar({ length: 255 }).notNull().default(''),
  timeZone: varchar({ length: 64 }).notNull().default('UTC'),
  createdAt: createdAt(),
  updatedAt: updatedAt(),
})

export const cameraModels = mysqlTable('camera_models', {
  id: int().autoincrement().primaryKey(),
  name: varchar({ length: 120 }).notNull().unique(),
  sensorWidthPx: int().notNull(),
  sensorHeightPx: int().notNull(),
  pixelPitchUm: double().notNull(),
  focalLengthMinMm: double().notNull(),
  focalLengthMaxMm: double().notNull(),
  fNumber: double().notNull(),
  createdAt: createdAt(),
  updatedAt: updatedAt(),
})

// A camera's purpose with its default thresholds (a supervisor may change them).
export const tasks = mysqlTable('tasks', {
  id: varchar({ length: 32 }).primaryKey(), // a code such as 'identify'
  name: varchar({ length: 80 }).notNull(),
  description: varchar({ length: 500 }).notNull().default(''),
  requiredPxPerM: double().notNull(),
  minMtf50CyPx: double().notNull(),
  marginalBand: double().notNull().default(0.1),
  driftWarnRatio: double().notNull().default(0.8),
  driftFailRatio: double().notNull().default(0.6),
  nightDayWarnRatio: double().notNull().default(0.8),
  checkIntervalDays: int().notNull(),
  workOrderPriority: mysqlEnum(PRIORITIES).notNull().default('normal'),
  workOrderDueDays: int().notNull(),
  sortOrder: int().notNull().default(0),
  version: int().notNull().default(1),
  updatedAt: updatedAt(),
})

export const cameras = mysqlTable(
  'cameras',
  {
    id: int().autoincrement().primaryKey(),
    assetTag: varchar({ length: 64 }).notNull().unique(),
    siteId: int()
      .notNull()
      .references(() => sites.id),
    locationText: varchar({ length: 255 }).notNull().default(''),
    cameraModelId: int()
      .notNull()
      .references(() => cameraModels.id),
    taskId: varchar({ length: 32 })
      .notNull()
      .references(() => tasks.id),
    // Per-camera overrides of the task's thresholds (null = use the task's value).
    requiredPxPerM: double(),
    minMtf50CyPx: double(),
    checkIntervalDays: int(),
    // Installation geometry, when known (for pixel density from lens and distance).
    focalLengthMm: double(),
    targetDistanceM: double(),
    baselineCheckId: uuid(),
    state: mysqlEnum(CAMERA_STATES).notNull().default('due'),
    lastCheckId: uuid(),
    lastCheckAt: when(),
    lastVerdict: mysqlEnum(VERDICTS),
    lastMtf50CyPx: double(),
    nextDueAt: when(),
    active: boolean().notNull().default(true),
    version: int().notNull().default(1),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [
    index('cameras_site_idx').on(t.siteId),
    index('cameras_state_idx').on(t.state),
    index('cameras_task_idx').on(t.taskId),
    index('cameras_model_idx').on(t.cameraModelId),
    index('cameras_next_due_idx').on(t.nextDueAt),
    // Fleet counts read every active camera's group and latest result from this index alone.
    index('cameras_fleet_idx').on(
      t.active,
      t.siteId,
      t.taskId,
      t.cameraModelId,
      t.lastCheckAt,
      t.lastVerdict,
      t.nextDueAt,
    ),
    // Camera table pages filtered by state and sorted by the last check or MTF50.
    index('cameras_state_check_idx').on(t.active, t.state, t.lastCheckAt),
    index('cameras_state_mtf_idx').on(t.active, t.state, t.lastMtf50CyPx),
    // Overdue cameras (next check date passed), counted and sorted from the index alone.
    index('cameras_due_mtf_idx').on(t.active, t.nextDueAt, t.lastMtf50CyPx),
  ],
)

export const rounds = mysqlTable(
  'rounds',
  {
    id: int().autoincrement().primaryKey(),
    name: varchar({ length: 120 }).notNull(),
    siteId: int().references(() => sites.id),
    assigneeId: int()
      .notNull()
      .references(() => users.id),
    dueAt: when().notNull(),
    status: mysqlEnum(ROUND_STATUSES).notNull().default('open'),
    createdBy: int()
      .notNull()
      .references(() => users.id),
    version: int().notNull().default(1),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [
    index('rounds_assignee_idx').on(t.assigneeId, t.status),
    index('rounds_due_idx').on(t.dueAt),
  ],
)

export const roundCameras = mysqlTable(
  'round_cameras',
  {
    roundId: int()
      .notNull()
      .references(() => rounds.id, { onDelete: 'cascade' }),
    cameraId: int()
      .notNull()
      .references(() => cameras.id),
    checkId: uuid(), // the check that completed this camera in the round
  },
  (t) => [
    primaryKey({ columns: [t.roundId, t.cameraId] }),
    index('round_cameras_camera_idx').on(t.cameraId),
  ],
)

export const checks = mysqlTable(
  'checks',
  {
    id: uuid().primaryKey(), // generated on the device
    cameraId: int()
      .notNull()
      .references(() => cameras.id),
    inspectorId: int()
      .notNull()
      .references(() => users.id),
    roundId: int().references(() => rounds.id),
    capturedAt: when().notNull(),
    mode: mysqlEnum(CHECK_MODES).notNull(),
    verdict: mysqlEnum(VERDICTS).notNull(),
    reasons: json().$type<VerdictReason[]>().notNull(),
    medianMtf50CyPx: double(),
    pixelDensityPxPerM: double(),
    baselineRatio: double(),
    targetId: varchar({ length: 64 }),
    notes: text(),
    isBaseline: boolean().notNull().default(false),
    // The inspector agreed to upload the full frame (it may show people or plates).
    shareFrame: boolean().notNull().default(false),
    deviceId: varchar({ length: 64 }).notNull(),
    createdAt: createdAt(),
    syncedAt: when(),
  },
  (t) => [
    index('checks_camera_time_idx').on(t.cameraId, t.capturedAt),
    index('checks_time_idx').on(t.capturedAt),
    index('checks_inspector_idx').on(t.inspectorId, t.capturedAt),
    // Fleet trends and period counts: checks in a period with their camera and result.
    index('checks_period_idx').on(t.capturedAt, t.cameraId, t.verdict, t.medianMtf50CyPx),
  ],
)

export const measurements = mysqlTable(
  'measurements',
  {
    id: uuid().primaryKey(),
    checkId: uuid()
      .notNull()
      .references(() => checks.id, { onDelete: 'cascade' }),
    roiX: int().notNull(),
    roiY: int().notNull(),
    roiW: int().notNull(),
    roiH: int().notNull(),
    orientation: mysqlEnum(EDGE_ORIENTATIONS).notNull(),
    angleDeg: double().notNull(),
    mtf50CyPx: double().notNull(),
    mtf50pCyPx: double(),
    mtf10CyPx: double(),
    mtfNyquist: double(),
    rise1090Px: double(),
    overshoot: double(),
    noise: double(),
    psfModel: mysqlEnum(PSF_MODELS),
    sigmaPx: double(),
    radiusPx: double(),
    psfRms: double(),
    mtfCurve: json().$type<MtfPoint[]>().notNull(),
    warnings: json().$type<string[]>().notNull(),
    serverMtf50CyPx: double(),
    disagreement: boolean().notNull().default(false),
  },
  (t) => [index('measurements_check_idx').on(t.checkId)],
)

export const attachments = mysqlTable(
  'attachments',
  {
    id: uuid().primaryKey(),
    checkId: uuid()
      .notNull()
      .references(() => checks.id, { onDelete: 'cascade' }),
    measurementId: uuid(),
    kind: mysqlEnum(ATTACHMENT_KINDS).notNull(),
    storageKey: varchar({ length: 255 }).notNull(),
    sha256: char({ length: 64 }).notNull(),
    bytes: int().notNull(),
    mime: varchar({ length: 64 }).notNull(),
    width: int().notNull(),
    height: int().notNull(),
    deleteAfter: when(), // retention (full frames)
    createdAt: createdAt(),
  },
  (t) => [
    index('attachments_check_idx').on(t.checkId),
    // The same bytes uploaded twice for one check are stored once.
    uniqueIndex('attachments_check_sha_uq').on(t.checkId, t.sha256),
    index('attachments_delete_after_idx').on(t.deleteAfter),
  ],
)

export const workOrders = mysqlTable(
  'work_orders',
  {
    id: int().autoincrement().primaryKey(),
    cameraId: int()
      .notNull()
      .references(() => cameras.id),
    openedByCheckId: uuid(),
    closedByCheckId: uuid(),
    priority: mysqlEnum(PRIORITIES).notNull().default('normal'),
    assigneeId: int().references(() => users.id),
    dueAt: when(),
    status: mysqlEnum(WORK_ORDER_STATUSES).notNull().default('open'),
    title: varchar({ length: 200 }).notNull(),
    description: text(),
    createdBy: int().references(() => users.id), // null when opened by a failing check
    closedAt: when(),
    version: int().notNull().default(1),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
    // The camera id while the order is still open in any way, null once closed or cancelled: its
    // unique index makes "one open order per camera" a database rule. Computed by the database.
    openCameraId: int().generatedAlwaysAs(
      sql`(case when \`status\` in ('closed', 'cancelled') then null else \`camera_id\` end)`,
      { mode: 'stored' },
    ),
  },
  (t) => [
    index('work_orders_status_idx').on(t.status),
    index('work_orders_assignee_idx').on(t.assigneeId),
    index('work_orders_camera_idx').on(t.cameraId),
    uniqueIndex('work_orders_open_camera_uq').on(t.openCameraId),
    index('work_orders_due_idx').on(t.dueAt),
  ],
)

// Photos that maintenance (or a supervisor) attached to a work order; the bytes live in storage.
export const workOrderPhotos = mysqlTable(
  'work_order_photos',
  {
    id: uuid().primaryKey(),
    workOrderId: int()
      .notNull()
      .references(() => workOrders.id),
    uploadedBy: int()
      .notNull()
      .references(() => users.id),
    storageKey: varchar({ length: 255 }).notNull(),
    sha256: char({ length: 64 }).notNull(),
    bytes: int().notNull(),
    mime: varchar({ length: 64 }).notNull(),
    width: int().notNull(),
    height: int().notNull(),
    createdAt: createdAt(),
  },
  (t) => [index('work_order_photos_order_idx').on(t.workOrderId)],
)

// Append-only: rows are inserted, never updated or deleted.
export const workOrderHistory = mysqlTable(
  'work_order_history',
  {
    id: int().autoincrement().primaryKey(),
    workOrderId: int()
      .notNull()
      .references(() => workOrders.id),
    actorId: int().references(() => users.id), // null for the system
    at: createdAt(),
    action: varchar({ length: 40 }).notNull(),
    fromStatus: mysqlEnum(WORK_ORDER_STATUSES),
    toStatus: mysqlEnum(WORK_ORDER_STATUSES),
    fromAssigneeId: int(),
    toAssigneeId: int(),
    checkId: uuid(),
    reason: text(),
    note: text(),
    photoId: uuid(), // the photo a photo entry added (work_order_photos.id)
  },
  (t) => [index('work_order_history_order_idx').on(t.workOrderId, t.at)],
)

// Transactional outbox: a row per e-mail, sent once by a worker with retries.
export const mailOutbox = mysqlTable(
  'mail_outbox',
  {
    id: int().autoincrement().primaryKey(),
    toAddress: varchar({ length: 254 }).notNull(),
    subject: varchar({ length: 255 }).notNull(),
    text: mediumtext().notNull(),
    html: mediumtext(),
    dedupeKey: varchar({ length: 191 }).notNull().unique(),
    status: mysqlEnum(MAIL_STATUSES).notNull().default('pending'),
    attempts: int().notNull().default(0),
    nextAttemptAt: when().notNull().default(now3),
    lastError: text(),
    sentAt: when(),
    createdAt: createdAt(),
    // What the mail is about (e.g. 'work_order.assigned', 'digest.overdue'), for people and tests.
    kind: varchar({ length: 40 }).notNull().default('other'),
    // A sender claims due rows before sending (several API replicas may drain at once): the
    // claim's token and the time after which an unfinished claim may be taken over.
    claimToken: uuid(),
    claimedUntil: when(),
  },
  (t) => [
    index('mail_outbox_due_idx').on(t.status, t.nextAttemptAt),
    index('mail_outbox_claim_idx').on(t.claimToken),
  ],
)

// One row per pushed operation id: replaying an operation returns the stored outcome.
export const syncOperations = mysqlTable(
  'sync_operations',
  {
    opId: uuid().primaryKey(),
    deviceId: varchar({ length: 64 }).notNull(),
    userId: int()
      .notNull()
      .references(() => users.id),
    kind: varchar({ length: 40 }).notNull(),
    status: mysqlEnum(SYNC_OP_STATUSES).notNull(),
    reason: text(),
    result: json().$type<Record<string, unknown>>(),
    appliedAt: createdAt(),
  },
  (t) => [index('sync_operations_device_idx').on(t.deviceId, t.appliedAt)],
)

// Monotonic change feed: every write to a synced entity appends a row; `seq` is the pull cursor.
export const changes = mysqlTable(
  'changes',
  {
    seq: bigint({ mode: 'number', unsigned: true }).autoincrement().primaryKey(),
    entity: varchar({ length: 40 }).notNull(),
    entityId: varchar({ length: 64 }).notNull(),
    action: mysqlEnum(CHANGE_ACTIONS).notNull().default('upsert'),
    at: createdAt(),
  },
  (t) => [index('changes_entity_idx').on(t.entity, t.entityId)],
)

export const auditLog = mysqlTable(
  'audit_log',
  {
    id: bigint({ mode: 'number', unsigned: true }).autoincrement().primaryKey(),
    actorId: int().references(() => users.id),
    action: varchar({ length: 64 }).notNull(),
    entity: varchar({ length: 40 }).notNull(),
    entityId: varchar({ length: 64 }),
    detail: json().$type<Record<string, unknown>>(),
    at: createdAt(),
  },
  (t) => [
    index('audit_log_at_idx').on(t.at),
    index('audit_log_entity_idx').on(t.entity, t.entityId),
  ],
)

// Maintained weekly aggregates for the fleet charts (server/services/fleet/weeks.ts): every
// recorded check adds one to its week's rows; a rebuild recomputes them from `checks`. Weeks
// start Monday 00:00 UTC; site and model are the camera's when the check was recorded.
export const fleetWeekSites = mysqlTable(
  'fleet_week_sites',
  {
    week: date({ mode: 'string' }).notNull(),
    siteId: int().notNull(),
    checks: int().notNull().default(0),
    passed: int().notNull().default(0),
    marginal: int().notNull().default(0),
    failed: int().notNull().default(0),
  },
  (t) => [primaryKey({ columns: [t.week, t.siteId] })],
)

export const fleetWeekModels = mysqlTable(
  'fleet_week_models',
  {
    week: date({ mode: 'string' }).notNull(),
    cameraModelId: int().notNull(),
    // Median MTF50 bin: floor(MTF50 / 0.025), the last bin holding everything above.
    mtfBin: smallint().notNull(),
    checks: int().notNull().default(0),
  },
  (t) => [primaryKey({ columns: [t.week, t.cameraModelId, t.mtfBin] })],
)

// One row once the weekly aggregates have been built from the checks in this database.
export const fleetAggregateState = mysqlTable('fleet_aggregate_state', {
  id: int().primaryKey(),
  rebuiltAt: datetime({ mode: 'date', fsp: 3 }).notNull(),
})
