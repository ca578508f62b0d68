// Text for figures on screen: impedances, admittances, decibels, frequencies.
import { formatEng, isInfinite, type Complex } from '../rf'

/**
 * A complex value with rounding noise removed: a part smaller than the last shown digit of the
 * larger part (`digits` significant figures) is zero, so 50 − j6e-15 Ω reads "50.00 + j0.000 Ω".
 */
export function withoutNoise(z: Complex, digits = 4): Complex {
  const scale = Math.max(Math.abs(z.re), Math.abs(z.im))
  if (!Number.isFinite(scale) || scale === 0) return z
  const floor = scale * 10 ** -digits
  return { re: Math.abs(z.re) < floor ? 0 : z.re, im: Math.abs(z.im) < floor ? 0 : z.im }
}

/** "18.0 − j32.0 Ω": a complex value with its unit; an open is "open (∞)". */
export function formatComplex(value: Complex, unit: string, digits = 4): string {
  if (isInfinite(value)) return 'open (∞)'
  const z = withoutNoise(value, digits)
  const sign = z.im < 0 || Object.is(z.im, -0) ? '−' : '+'
  const part = (x: number) => {
    const a = Math.abs(x)
    if (a !== 0 && (a < 1e-3 || a >= 1e6)) return a.toExponential(digits - 1)
    return a.toPrecision(digits)
  }
  return `${z.re < 0 ? '−' : ''}${part(z.re)} ${sign} j${part(z.im)} ${unit}`.trim()
}

// Beyond this a return loss is rounding noise of an exact match, not a figure worth reading.
const DB_CEILING = 100

/** A decibel figure: one decimal, two below 1 dB; an exact match shows as "> 100 dB". */
export function formatDb(db: number | null): string {
  if (db === null || Number.isNaN(db)) return '—'
  if (db > DB_CEILING) return `> ${DB_CEILING} dB`
  if (!Number.isFinite(db)) return '−∞ dB'
  return `${db.toFixed(Math.abs(db) < 1 ? 2 : 1)} dB`
}

/** A plain figure to a few significant digits; infinity as "∞". */
export function formatFigure(x: number, digits = 3): string {
  if (!Number.isFinite(x)) return '∞'
  // Rounding noise of an exact zero (a node Q of 1e-16 at a real point) reads as zero.
  if (Math.abs(x) < 1e-9) return '0'
  return String(Number(x.toPrecision(digits)))
}

export function formatFrequency(hz: number): string {
  return formatEng(hz, 'Hz')
}
