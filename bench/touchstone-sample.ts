// A generated two-port Touchstone file for timing the reader and writer: seeded, so every run
// times the same text. The data are random numbers in MA form, not a physical network.
import seedrandom from 'seedrandom'

/** Text of a .s2p file with `rows` data lines (MHz, MA, R 50) and a two-line header. */
export function sampleS2p(rows: number, seed = 'touchstone-bench'): string {
  const random = seedrandom(seed)
  const lines = new Array<string>(rows + 2)
  lines[0] = '! generated sample for timing: random magnitudes and angles'
  lines[1] = '# MHz S MA R 50'
  for (let k = 0; k < rows; k++) {
    let row = String(100 + k * 0.01)
    for (let p = 0; p < 4; p++) row += ` ${random().toPrecision(10)} ${(random() * 360 - 180).toPrecision(10)}`
    lines[k + 2] = row
  }
  return lines.join('\n')
}
