// Dates and numbers as people read them. Times shown in the device's locale and time zone.
const dateFmt = new Intl.DateTimeFormat(undefined, {
  day: 'numeric',
  month: 'short',
  year: 'numeric',
})
const dateTimeFmt = new Intl.DateTimeFormat(undefined, {
  day: 'numeric',
  month: 'short',
  hour: '2-digit',
  minute: '2-digit',
})

export function formatDate(iso: string | null): string {
  return iso ? dateFmt.format(new Date(iso)) : '—'
}

export function formatDateTime(iso: string | null): string {
  return iso ? dateTimeFmt.format(new Date(iso)) : '—'
}

/** "just now", "12 min ago", "3 h ago", "2 days ago". */
export function formatAgo(iso: string | null, now = new Date()): string {
  if (!iso) return 'never'
  const s = Math.max(0, Math.round((now.getTime() - Date.parse(iso)) / 1000))
  if (s < 60) return 'just now'
  if (s < 3600) return `${Math.floor(s / 60)} min ago`
  if (s < 86_400) return `${Math.floor(s / 3600)} h ago`
  const d = Math.floor(s / 86_400)
  return d === 1 ? '1 day ago' : `${d} days ago`
}

export function formatDays(days: number): string {
  return days === 1 ? '1 day' : `${days} days`
}

/** A number with a fixed count of decimals, or a dash. */
export function formatNumber(value: number | null | undefined, decimals = 0): string {
  return value === null || value === undefined || !Number.isFinite(value)
    ? '—'
    : value.toFixed(decimals)
}

export function formatPercent(ratio: number): string {
  return `${Math.round(ratio * 100)} %`
}
