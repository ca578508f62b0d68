// Text for figures on screen: impedances, admittances, decibels, frequencies.
import { formatEng, isInfinite, type Complex } from '../rf'

/** "18.0 − j32.0 Ω": a complex value with its unit; an open is "open (∞)". */
export function formatComplex(z: Complex, unit: string, digits = 4): string {
  if (isInfinite(z)) return 'open (∞)'
  const sign = z.im < 0 || Object.is(z.im, -0) ? '−' : '+'
  const part = (x: number) => {
    const a = Math.abs(x)
    if (a !== 0 && (a < 1e-3 || a >= 1e6)) return a.toExponential(digits - 1)
    return a.toPrecision(digits)
  }
  return `${z.re < 0 ? '−' : ''}${part(z.re)} ${sign} j${part(z.im)} ${unit}`.trim()
}

/** A decibel figure with one decimal; a perfect match is "∞ dB". */
export function formatDb(db: number | null): string {
  if (db === null || Number.isNaN(db)) return '—'
  if (!Number.isFinite(db)) return db > 0 ? '∞ dB' : '−∞ dB'
  return `${db.toFixed(1)} dB`
}

/** A plain figure to a few significant digits; infinity as "∞". */
export function formatFigure(x: number, digits = 3): string {
  if (!Number.isFinite(x)) return '∞'
  return String(Number(x.toPrecision(digits)))
}

export function formatFrequency(hz: number): string {
  return formatEng(hz, 'Hz')
}
