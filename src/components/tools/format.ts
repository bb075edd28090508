// Numbers for people: a sensible number of digits for the size of the value.

/** 3 significant figures below 100, whole numbers above; '∞' for infinity. */
export function fmt(value: number): string {
  if (value === Infinity) return '∞'
  if (!Number.isFinite(value)) return '–'
  const abs = Math.abs(value)
  if (abs >= 100) return String(Math.round(value))
  if (abs >= 10) return (Math.round(value * 10) / 10).toString()
  if (abs >= 1) return (Math.round(value * 100) / 100).toString()
  return Number(value.toPrecision(2)).toString()
}

/** A distance in metres; below 1 m in millimetres. */
export function fmtDistance(metres: number): string {
  if (metres === Infinity) return '∞'
  return metres < 1 ? `${fmt(metres * 1000)} mm` : `${fmt(metres)} m`
}
