import { describe, expect, it } from 'vitest'
import { escapeHtml, renderMail, subjectLine } from '../templates/document'
import { assignedMail, digestMail } from '../templates/workOrderMails'

const order = {
  id: 12,
  title: 'Soft image on <QG-1>',
  assetTag: 'QG-1',
  siteName: 'Quarry "Gate" & Yard',
  locationText: 'Pole 3',
  priority: 'high' as const,
  status: 'assigned' as const,
  dueAt: new Date(Date.UTC(2031, 5, 12, 14, 5)),
}

describe('mail documents', () => {
  it('escapes the five HTML special characters', () => {
    expect(escapeHtml(`<a href="x">Tom's & Jerry</a>`)).toBe(
      '&lt;a href=&quot;x&quot;&gt;Tom&#39;s &amp; Jerry&lt;/a&gt;',
    )
  })

  it('renders user text escaped in HTML and verbatim in plain text', () => {
    const mail = assignedMail(order, {
      assigneeName: '<img src=x onerror=alert(1)>',
      byName: 'Rhea',
      url: 'https://sharpfield.example.test/work-orders/12',
    })
    expect(mail.html).not.toContain('<img')
    expect(mail.html).toContain('&lt;img src=x onerror=alert(1)&gt;')
    expect(mail.html).toContain('Quarry &quot;Gate&quot; &amp; Yard')
    expect(mail.text).toContain('Hello <img src=x onerror=alert(1)>,')
    expect(mail.text).toContain('Due:        12 Jun 2031, 14:05 UTC')
    expect(mail.html).toContain('href="https://sharpfield.example.test/work-orders/12"')
  })

  it('drops links that are not http(s) and keeps subjects on one line', () => {
    const mail = renderMail('Line one\r\nBcc: someone@else.test', {
      heading: 'x',
      paragraphs: [],
      action: { label: 'Open', url: 'javascript:alert(1)' },
    })
    expect(mail.subject).toBe('Line one Bcc: someone@else.test')
    expect(mail.html).not.toContain('javascript:')
    expect(subjectLine('a'.repeat(300)).length).toBe(200)
  })

  it('the digest counts days overdue (whole days, at least one)', () => {
    const now = new Date(order.dueAt.getTime() + 5.5 * 86_400_000)
    const mail = digestMail([order, { ...order, id: 13, dueAt: new Date(now.getTime() - 3_600_000) }], {
      supervisorName: 'Rhea',
      day: '2031-06-17',
      now,
      listUrl: 'https://s.test/work-orders',
      orderUrl: (id) => `https://s.test/work-orders/${id}`,
    })
    expect(mail.subject).toBe('Overdue work orders, 2031-06-17: 2')
    expect(mail.text).toContain('#12 QG-1 at Quarry "Gate" & Yard: assigned, high priority, 5 days overdue')
    expect(mail.text).toContain('#13 QG-1 at Quarry "Gate" & Yard: assigned, high priority, 1 day overdue')
  })
})
