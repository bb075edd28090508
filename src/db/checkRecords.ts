// Reading and writing the device's checks (tables in ./checks.ts), and the `check.create`
// payload a saved check becomes for the server.
import { checkCreatePayloadSchema, type CheckCreatePayload } from '@shared/schemas/checks'
import { measurementPayload } from '@shared/schemas/measurementPayload'
import type { CheckRecord, CropRecord, FrameRecord, MeasurementRecord } from './checks'
import type { SharpfieldDb } from './database'

export interface CheckBundle {
  check: CheckRecord
  measurements: MeasurementRecord[]
  frame: FrameRecord | null
  crops: CropRecord[]
}

/** Joins the free notes and the exposure and lens notes into the one notes field the server keeps. */
export function combinedNotes(
  c: Pick<CheckRecord, 'notes' | 'exposureNote' | 'lensNote'>,
): string | null {
  const parts = [
    c.notes?.trim(),
    c.exposureNote?.trim() ? `Exposure: ${c.exposureNote.trim()}` : '',
    c.lensNote?.trim() ? `Lens: ${c.lensNote.trim()}` : '',
  ].filter(Boolean)
  return parts.length ? parts.join('\n').slice(0, 2000) : null
}

/**
 * The `check.create` operation's payload: the check and the measurements its verdict used
 * (enabled, valid, with an MTF50). Validated against the shared schema, so a bad record fails
 * here, on the device, with the schema's message.
 */
export function toCheckCreatePayload(
  check: CheckRecord,
  measurements: MeasurementRecord[],
  cameraVersion?: number,
): CheckCreatePayload {
  const used = measurements
    .filter((m) => m.enabled && m.valid && m.measurement.mtf50 !== null)
    .sort((a, b) => a.index - b.index)
  return checkCreatePayloadSchema.parse({
    id: check.id,
    cameraId: check.cameraId,
    roundId: check.roundId,
    capturedAt: check.capturedAt,
    mode: check.mode,
    verdict: check.verdict,
    reasons: check.reasons.slice(0, 30).map((r) => ({
      code: r.code,
      text: r.message.slice(0, 500),
      severity: r.severity,
      values: r.values,
    })),
    medianMtf50CyPx: check.medianMtf50CyPx,
    pixelDensityPxPerM: check.pixelDensity?.pxPerM ?? null,
    baselineRatio: check.baselineRatio,
    targetId: check.targetId,
    notes: combinedNotes(check),
    shareFrame: check.shareFrame,
    ...(cameraVersion ? { cameraVersion } : {}),
    measurements: used.map(({ id, measurement }) => measurementPayload(id, measurement)),
  })
}

/** The tables a saved check touches (for callers that add their own, e.g. the outbox). */
export function checkTables(db: SharpfieldDb) {
  return [db.checks, db.measurements, db.frames, db.crops]
}

/** Writes a check with its regions, frame and crops; call inside a transaction on checkTables. */
export async function putCheckBundle(db: SharpfieldDb, bundle: CheckBundle): Promise<void> {
  await db.checks.put(bundle.check)
  await db.measurements.bulkPut(bundle.measurements)
  if (bundle.frame) await db.frames.put(bundle.frame)
  if (bundle.crops.length) await db.crops.bulkPut(bundle.crops)
}

/** This user's checks of a camera, newest first. */
export async function localChecksOf(
  db: SharpfieldDb,
  cameraId: number,
  userId: number,
): Promise<CheckRecord[]> {
  const rows = await db.checks
    .where('[cameraId+capturedAt]')
    .between([cameraId, ''], [cameraId, '\uffff'])
    .reverse()
    .toArray()
  return rows.filter((c) => c.userId === userId)
}

export async function loadCheckBundle(db: SharpfieldDb, id: string): Promise<CheckBundle | null> {
  const check = await db.checks.get(id)
  if (!check) return null
  const [measurements, frame, crops] = await Promise.all([
    db.measurements.where('checkId').equals(id).sortBy('index'),
    db.frames.get(id),
    db.crops.where('checkId').equals(id).toArray(),
  ])
  return { check, measurements, frame: frame ?? null, crops }
}

/** Marks one check as its camera's baseline on the device (and no other check of the camera). */
export async function setLocalBaseline(db: SharpfieldDb, checkId: string, cameraId: number) {
  await db.transaction('rw', db.checks, async () => {
    await db.checks
      .where('cameraId')
      .equals(cameraId)
      .modify((c) => {
        c.isBaseline = c.id === checkId
      })
  })
}
