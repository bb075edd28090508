// A small in-process scheduler: each job runs every `intervalMs`, never overlapping itself; an
// error is logged and the job runs again at its next turn. stop() waits for running jobs.
import type { Logger } from '../errors'

export interface Job {
  name: string
  intervalMs: number
  run(): Promise<unknown>
  /** Run once right after start (default true). */
  runAtStart?: boolean
}

export interface Scheduler {
  start(): void
  /** Runs a job now (or waits for its current run, then runs it again); resolves when done. */
  runNow(name: string): Promise<void>
  stop(): Promise<void>
  readonly running: boolean
}

interface Slot {
  job: Job
  timer: NodeJS.Timeout | null
  current: Promise<void> | null
}

export function createScheduler(jobs: readonly Job[], logger: Logger): Scheduler {
  for (const job of jobs) {
    if (!(job.intervalMs > 0)) throw new RangeError(`Job ${job.name} needs an interval above 0 ms.`)
  }
  const slots = new Map<string, Slot>(jobs.map((job) => [job.name, { job, timer: null, current: null }]))
  let running = false

  function schedule(slot: Slot, delayMs: number): void {
    if (!running) return
    slot.timer = setTimeout(() => {
      slot.timer = null
      void execute(slot).then(() => schedule(slot, slot.job.intervalMs))
    }, delayMs)
  }

  function execute(slot: Slot): Promise<void> {
    if (slot.current) return slot.current
    slot.current = slot.job
      .run()
      .then(
        () => undefined,
        (err: unknown) => logger.error(`Background job ${slot.job.name} failed:`, err),
      )
      .finally(() => {
        slot.current = null
      })
    return slot.current
  }

  return {
    get running() {
      return running
    },
    start() {
      if (running) return
      running = true
      for (const slot of slots.values()) schedule(slot, slot.job.runAtStart === false ? slot.job.intervalMs : 0)
    },
    async runNow(name) {
      const slot = slots.get(name)
      if (!slot) throw new RangeError(`There is no background job named ${name}.`)
      if (slot.current) await slot.current
      await execute(slot)
    },
    async stop() {
      running = false
      for (const slot of slots.values()) {
        if (slot.timer) clearTimeout(slot.timer)
        slot.timer = null
      }
      await Promise.all([...slots.values()].map((s) => s.current))
    },
  }
}
