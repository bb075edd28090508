import { describe, expect, it } from 'vitest'
import LabelTag from '../LabelTag.vue'
import type { TagLook } from '../labelTag'
import { classesOf, renderHtml, textOf } from './renderHtml'

const LOOKS: Record<'ready' | 'held', TagLook> = {
  ready: { label: 'Ready', icon: 'success', tone: 'green-soft' },
  held: { label: 'Held back', icon: 'warning-o', tone: 'amber-solid' },
}

describe('a labelled tag', () => {
  it('shows the word, icon and tone its table gives the value', async () => {
    const html = await renderHtml(LabelTag, { looks: LOOKS, value: 'held' })
    expect(textOf(html)).toBe('Held back')
    expect(classesOf(html, 'label-tag')).toContain('label-tag--amber-solid')
    expect(classesOf(html, 'van-icon')).toContain('van-icon-warning-o')
  })

  it('keeps the icon out of what a screen reader says', async () => {
    const html = await renderHtml(LabelTag, { looks: LOOKS, value: 'ready' })
    expect(html).toMatch(/<i [^>]*van-icon-success[^>]*aria-hidden="true"/)
  })

  it('shows the given text in place of the word, with the value’s look', async () => {
    const html = await renderHtml(LabelTag, { looks: LOOKS, value: 'ready', text: 'Ready in 2 d' })
    expect(textOf(html)).toBe('Ready in 2 d')
    expect(classesOf(html, 'label-tag')).toContain('label-tag--green-soft')
  })

  it('carries the caller’s data-test for the browser tests', async () => {
    const html = await renderHtml(LabelTag, { looks: LOOKS, value: 'ready', 'data-test': 'x-tag' })
    expect(html).toMatch(/<span [^>]*data-test="x-tag"/)
  })
})
