import { availableParallelism } from 'node:os'
import { resolve } from 'node:path'
import { z } from 'zod'

// Configuration comes from the environment only, validated once at start (fail fast).
// Defaults suit `npm start` on one machine; README lists every variable.

const port = z.coerce.number().int().min(0).max(65535)
const flag = z.stringbool({
  truthy: ['true', '1', 'yes', 'on'],
  falsy: ['false', '0', 'no', 'off'],
})

const envSchema = z.object({
  PORT: port.default(8080),
  HOST: z.string().min(1).default('127.0.0.1'),
  DATABASE_URL: z
    .string()
    .regex(/^mysql:\/\//, 'must start with mysql://')
    .optional(),
  DB_HOST: z.string().min(1).default('127.0.0.1'),
  DB_PORT: port.default(3307),
  DB_NAME: z
    .string()
    .regex(/^[A-Za-z0-9_]+$/, 'letters, digits and _ only')
    .default('sharpfield'),
  DB_USER: z.string().min(1).default('sharpfield'),
  DB_PASSWORD: z.string().default('sharpfield'),
  SMTP_HOST: z.string().min(1).default('127.0.0.1'),
  SMTP_PORT: port.default(2525),
  SMTP_USER: z.string().optional(),
  SMTP_PASSWORD: z.string().optional(),
  SMTP_SECURE: flag.default(false),
  MAIL_FROM: z.string().min(3).default('Sharpfield <noreply@sharpfield.test>'),
  // Where people open the app; links in e-mails start with it (default: http://HOST:PORT).
  PUBLIC_URL: z.url().optional(),
  DATA_DIR: z.string().min(1).default('.data'),
  DEMO_MODE: flag.default(true),
  STATIC_DIR: z.string().min(1).default('dist'),
  JWT_SECRET: z.string().min(32, 'must be at least 32 characters').optional(),
  // Express "trust proxy": unset = trust no proxy (req.ip is the socket address).
  TRUST_PROXY: z.string().optional(),
  // Uploaded check images (server/storage): size limit per file, and how long full frames
  // (which may show people or plates) are kept. Region crops are kept with their check.
  UPLOAD_MAX_MB: z.coerce.number().positive().max(200).default(25),
  FRAME_RETENTION_DAYS: z.coerce.number().int().min(1).max(3650).default(30),
  // Server processes on this machine ('auto' = one per CPU core) and database connections each.
  WORKERS: z
    .union([z.literal('auto'), z.coerce.number().int().min(1).max(64)])
    .default(1),
  DB_POOL_SIZE: z.coerce.number().int().min(1).max(500).default(10),
  // Pull leaves out changes younger than this, so a transaction still committing is never skipped.
  SYNC_SETTLE_MS: z.coerce.number().int().min(0).max(60_000).default(1000),
})

export interface SmtpConfig {
  host: string
  port: number
  secure: boolean
  user?: string
  password?: string
}

export interface Config {
  port: number
  host: string
  databaseUrl: string
  smtp: SmtpConfig
  mailFrom: string
  /** Base URL of the app for links in e-mails, without a trailing slash. */
  publicUrl: string
  dataDir: string
  demoMode: boolean
  staticDir: string
  jwtSecret?: string
  trustProxy: boolean | number | string
  uploads: UploadConfig
  /** See SYNC_SETTLE_MS. */
  syncSettleMs: number
  /** Server processes to run (node:cluster when more than one). */
  workers: number
  /** Database connections per server process. */
  dbPoolSize: number
}

export interface UploadConfig {
  maxBytes: number
  frameRetentionDays: number
}

export class ConfigError extends Error {
  override name = 'ConfigError'
}

function parseTrustProxy(value: string | undefined): boolean | number | string {
  if (value === undefined) return false
  if (value === 'true') return true
  if (value === 'false') return false
  if (/^\d+$/.test(value)) return Number(value)
  return value // e.g. 'loopback' or a list of addresses
}

/** Parses the environment; throws ConfigError naming every bad variable. */
export function loadConfig(env: NodeJS.ProcessEnv = process.env, cwd = process.cwd()): Config {
  // An empty variable counts as unset.
  const present = Object.fromEntries(
    Object.entries(env).filter(([, v]) => v !== undefined && v !== ''),
  )
  const parsed = envSchema.safeParse(present)
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`)
    throw new ConfigError(`Invalid configuration:\n${lines.join('\n')}`)
  }
  const e = parsed.data
  const databaseUrl =
    e.DATABASE_URL ??
    `mysql://${encodeURIComponent(e.DB_USER)}:${encodeURIComponent(e.DB_PASSWORD)}@${e.DB_HOST}:${e.DB_PORT}/${e.DB_NAME}`
  return {
    port: e.PORT,
    host: e.HOST,
    databaseUrl,
    smtp: {
      host: e.SMTP_HOST,
      port: e.SMTP_PORT,
      secure: e.SMTP_SECURE,
      user: e.SMTP_USER,
      password: e.SMTP_PASSWORD,
    },
    mailFrom: e.MAIL_FROM,
    publicUrl: (e.PUBLIC_URL ?? `http://${e.HOST}:${e.PORT}`).replace(/\/+$/, ''),
    dataDir: resolve(cwd, e.DATA_DIR),
    demoMode: e.DEMO_MODE,
    staticDir: resolve(cwd, e.STATIC_DIR),
    jwtSecret: e.JWT_SECRET,
    trustProxy: parseTrustProxy(e.TRUST_PROXY),
    uploads: {
      maxBytes: Math.round(e.UPLOAD_MAX_MB * 1024 * 1024),
      frameRetentionDays: e.FRAME_RETENTION_DAYS,
    },
    syncSettleMs: e.SYNC_SETTLE_MS,
    workers: e.WORKERS === 'auto' ? availableParallelism() : e.WORKERS,
    dbPoolSize: e.DB_POOL_SIZE,
  }
}

/** The database URL with the password masked, for logs. */
export function redactUrl(url: string): string {
  return url.replace(/\/\/([^:/@]+):[^@]*@/, '//$1:***@')
}
