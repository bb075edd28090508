import { describe, expect, it } from 'vitest'
import { classesOf, renderHtml, textOf } from '@/components/common/__tests__/renderHtml'
import CameraStateTag from '../CameraStateTag.vue'
import VerdictTag from '../VerdictTag.vue'

const tone = (html: string) => classesOf(html, 'label-tag').find((c) => c.startsWith('label-tag--'))

describe('a verdict tag', () => {
  it('names each verdict in words, each on its own colour', async () => {
    const seen = new Map<string, string | undefined>()
    for (const verdict of ['pass', 'marginal', 'fail'] as const) {
      const html = await renderHtml(VerdictTag, { verdict })
      expect(html).toContain('data-test="verdict-tag"')
      seen.set(textOf(html), tone(html))
    }
    expect([...seen.keys()]).toEqual(['Pass', 'Marginal', 'Fail'])
    expect(new Set(seen.values()).size).toBe(3)
  })
})

describe('a camera state tag', () => {
  it('counts the days when the camera is overdue', async () => {
    const html = await renderHtml(CameraStateTag, { urgency: 'overdue', daysOverdue: 3 })
    expect(textOf(html)).toBe('Overdue 3 d')
    expect(html).toContain('data-test="state-tag"')
  })

  it('says only "Overdue" when the days are not known or not yet one', async () => {
    for (const daysOverdue of [null, 0, undefined]) {
      const html = await renderHtml(CameraStateTag, { urgency: 'overdue', daysOverdue })
      expect(textOf(html)).toBe('Overdue')
    }
  })

  it('names every other state in words and ignores a day count there', async () => {
    const words: string[] = []
    for (const urgency of ['failing', 'due', 'in_repair', 'ok'] as const)
      words.push(textOf(await renderHtml(CameraStateTag, { urgency, daysOverdue: 5 })))
    expect(words).toEqual(['Failing', 'Due', 'In repair', 'OK'])
  })

  it('tells "due" from "overdue" by colour as well as by word', async () => {
    const due = await renderHtml(CameraStateTag, { urgency: 'due' })
    const overdue = await renderHtml(CameraStateTag, { urgency: 'overdue' })
    expect(tone(due)).not.toBe(tone(overdue))
  })
})
