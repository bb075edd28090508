import { afterEach, describe, expect, it, vi } from 'vitest'
import { createScheduler } from '../scheduler'

const quiet = { info: () => {}, error: vi.fn() }

afterEach(() => {
  vi.useRealTimers()
})

describe('the job scheduler', () => {
  it('runs each job at start and then every interval, never two runs of a job at once', async () => {
    vi.useFakeTimers()
    let running = 0
    let most = 0
    let runs = 0
    const s = createScheduler(
      [
        {
          name: 'slow',
          intervalMs: 1000,
          async run() {
            runs++
            running++
            most = Math.max(most, running)
            await new Promise((r) => setTimeout(r, 2500))
            running--
          },
        },
      ],
      quiet,
    )
    s.start()
    await vi.advanceTimersByTimeAsync(0)
    expect(runs).toBe(1)
    await vi.advanceTimersByTimeAsync(2500 + 1000)
    expect(runs).toBe(2) // the next run waits for the last one to end, then the interval
    await vi.advanceTimersByTimeAsync(10_000)
    expect(most).toBe(1)
    await s.stop()
  })

  it('logs a failing run and keeps going; stop() waits for the run in progress', async () => {
    vi.useFakeTimers()
    let runs = 0
    let finished = false
    const s = createScheduler(
      [
        {
          name: 'flaky',
          intervalMs: 100,
          async run() {
            runs++
            if (runs === 1) throw new Error('SMTP down')
            await new Promise((r) => setTimeout(r, 50))
            finished = true
          },
        },
      ],
      quiet,
    )
    s.start()
    await vi.advanceTimersByTimeAsync(110)
    expect(quiet.error).toHaveBeenCalledWith('Background job flaky failed:', expect.any(Error))
    expect(runs).toBe(2)
    const stopped = s.stop()
    await vi.advanceTimersByTimeAsync(60)
    await stopped
    expect(finished).toBe(true)
    await vi.advanceTimersByTimeAsync(1000)
    expect(runs).toBe(2) // nothing after stop
  })

  it('refuses a job without a positive interval, and an unknown job name', async () => {
    expect(() => createScheduler([{ name: 'x', intervalMs: 0, run: async () => {} }], quiet)).toThrow(RangeError)
    await expect(createScheduler([], quiet).runNow('nope')).rejects.toThrow('There is no background job named nope.')
  })
})
