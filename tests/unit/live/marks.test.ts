import { describe, expect, it } from 'vitest'
import { presenceMarks } from '../../../shared/live/marks'

const view = { originX: 200, originY: 150, scalePx: 100 }
const user = (id: number, name: string) => ({ id, name, colour: '#1f5f8b', role: 'designer' as const })

describe('presenceMarks', () => {
  it('places pointers by the view transform and labels drags with the draft value', () => {
    const marks = presenceMarks([
      { clientId: 1, user: user(1, 'Tomas Reyes'), pointer: { re: 0.5, im: 0.25 }, dragging: { elementId: 'c1', value: 4.7e-12 } },
      { clientId: 2, user: user(2, 'Mara Quell'), pointer: { re: -1, im: 0 }, dragging: null },
      { clientId: 3, user: user(3, 'Ines Halvorsen'), pointer: null, dragging: null },
    ], [{ id: 'l1', kind: 'L' }, { id: 'c1', kind: 'C' }], view)
    expect(marks).toHaveLength(2)
    expect(marks[0]).toMatchObject({ key: '1', x: 250, y: 125, label: 'Tomas: C2 4.7 pF' })
    expect(marks[1]).toMatchObject({ key: '2', x: 100, y: 150, label: 'Mara' })
  })
  it('still shows a drag whose element is gone', () => {
    const [mark] = presenceMarks([{ clientId: 9, user: user(9, 'Tomas'), pointer: { re: 0, im: 0 }, dragging: { elementId: 'x', value: 1 } }], [], view)
    expect(mark!.label).toBe('Tomas: dragging')
  })
})
