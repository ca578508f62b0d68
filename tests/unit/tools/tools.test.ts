// The chart's pointer tools as state machines, driven without a canvas.
import { describe, expect, it } from 'vitest'
import type { DragResult } from '../../../shared/rf/drag'
import { createDragTool, type DragToolActions } from '../../../composables/tools/dragTool'
import { createPanTool } from '../../../composables/tools/panTool'
import { createFrameCoalescer } from '../../../composables/tools/frameCoalescer'
import { createChartPointer } from '../../../composables/tools/chartPointer'

function recorder() {
  const calls: string[] = []
  const result = (value: number): DragResult => ({ value, field: 'value', z: { re: 50, im: 0 }, gamma: { re: 0, im: 0 } })
  const actions: DragToolActions = {
    begin: (id) => { calls.push(`begin ${id}`); return id !== 'locked' },
    solve: (id, p) => (id === 'gone' ? null : result(p.re)),
    preview: (v) => { calls.push(`preview ${v}`) },
    commit: () => { calls.push('commit') },
    cancel: () => { calls.push('cancel') },
  }
  return { calls, actions }
}

function manualFrames() {
  const queue: (() => void)[] = []
  return { schedule: (cb: () => void) => { queue.push(cb) }, frame: () => queue.splice(0).forEach(cb => cb()), queue }
}

describe('dragTool', () => {
  it('begins, previews each move, commits once on release', () => {
    const { calls, actions } = recorder()
    const tool = createDragTool(actions)
    expect(tool.down('c1')).toBe(true)
    tool.move({ re: 0.1, im: 0 })
    tool.move({ re: 0.2, im: 0 })
    tool.up()
    tool.up()
    expect(calls).toEqual(['begin c1', 'preview 0.1', 'preview 0.2', 'commit'])
    expect(tool.state().mode).toBe('idle')
  })

  it('does not start when the board refuses, and ignores moves while idle', () => {
    const { calls, actions } = recorder()
    const tool = createDragTool(actions)
    expect(tool.down('locked')).toBe(false)
    expect(tool.move({ re: 0.3, im: 0 })).toBeNull()
    tool.up()
    expect(calls).toEqual(['begin locked'])
  })

  it('cancels on Escape without committing, and when the element goes away', () => {
    const a = recorder()
    const tool = createDragTool(a.actions)
    tool.down('c1')
    tool.move({ re: 0.4, im: 0 })
    tool.cancel()
    tool.up()
    expect(a.calls).toEqual(['begin c1', 'preview 0.4', 'cancel'])
    const b = recorder()
    const other = createDragTool(b.actions)
    other.down('gone')
    expect(other.move({ re: 0.1, im: 0 })).toBeNull()
    expect(b.calls).toEqual(['begin gone', 'cancel'])
    expect(other.isDragging()).toBe(false)
  })
})

describe('panTool', () => {
  it('previews the offset and hands the total over once', () => {
    const seen: string[] = []
    const pan = createPanTool({ offset: (x, y) => seen.push(`offset ${x},${y}`), finish: (x, y) => seen.push(`finish ${x},${y}`) })
    pan.move(5, 5)
    pan.down(10, 10)
    pan.move(15, 12)
    pan.move(30, 4)
    pan.up()
    expect(seen).toEqual(['offset 5,2', 'offset 20,-6', 'finish 20,-6'])
    expect(pan.isPanning()).toBe(false)
  })

  it('snaps back on cancel', () => {
    const seen: string[] = []
    const pan = createPanTool({ offset: (x, y) => seen.push(`offset ${x},${y}`), finish: (x, y) => seen.push(`finish ${x},${y}`) })
    pan.down(0, 0)
    pan.move(9, 9)
    pan.cancel()
    expect(seen).toEqual(['offset 9,9', 'offset 0,0', 'finish 0,0'])
  })
})

describe('frameCoalescer', () => {
  it('runs only the newest value once per frame', () => {
    const frames = manualFrames()
    const ran: number[] = []
    const c = createFrameCoalescer<number>(v => ran.push(v), frames.schedule)
    c.push(1)
    c.push(2)
    c.push(3)
    expect(frames.queue.length).toBe(1)
    frames.frame()
    c.push(4)
    c.flush()
    frames.frame()
    c.push(5)
    c.drop()
    frames.frame()
    expect(ran).toEqual([3, 4])
  })
})

describe('chartPointer', () => {
  function setup() {
    const { calls, actions } = recorder()
    const frames = manualFrames()
    const pans: string[] = []
    const hovers: (number | null)[] = []
    const clicks: string[] = []
    const drag = createDragTool(actions)
    const pan = createPanTool({ offset: (x, y) => pans.push(`${x},${y}`), finish: (x, y) => pans.push(`end ${x},${y}`) })
    const pointer = createChartPointer({
      drag, pan,
      handleAt: (x, y) => (Math.hypot(x - 100, y - 100) < 10 ? 'c1' : null),
      toGamma: (x, y) => ({ re: x / 1000, im: -y / 1000 }),
      hover: g => hovers.push(g ? g.re : null),
      click: (x, y) => clicks.push(`${x},${y}`),
      schedule: frames.schedule,
      now: () => 0,
    })
    return { pointer, calls, frames, pans, hovers, clicks }
  }

  it('drags from a handle, one preview per frame, and commits the last position on release', () => {
    const { pointer, calls, frames } = setup()
    expect(pointer.down(102, 99)).toBe('dragging')
    pointer.move(150, 100)
    pointer.move(160, 100)
    frames.frame()
    pointer.move(170, 100)
    pointer.up()
    expect(calls).toEqual(['begin c1', 'preview 0.16', 'preview 0.17', 'commit'])
    expect(pointer.mode()).toBe('idle')
  })

  it('pans from the background and hovers without a press', () => {
    const { pointer, pans, hovers, calls } = setup()
    pointer.move(300, 300)
    expect(pointer.down(300, 300)).toBe('panning')
    pointer.move(320, 310)
    pointer.up()
    pointer.leave()
    expect(pans).toEqual(['20,10', 'end 20,10'])
    expect(hovers).toEqual([0.3, 0.32, null])
    expect(calls).toEqual([])
  })

  it('turns a press and release without movement into a click, not a pan', () => {
    const { pointer, pans, clicks } = setup()
    pointer.down(400, 300)
    pointer.move(401, 301)
    pointer.up()
    expect(clicks).toEqual(['400,300'])
    expect(pans).toEqual(['1,1', '0,0', 'end 0,0'])
    pointer.down(400, 300)
    pointer.move(420, 300)
    pointer.up()
    expect(clicks).toEqual(['400,300'])
  })

  it('ignores other buttons and cancels a drag without committing', () => {
    const { pointer, calls, frames } = setup()
    expect(pointer.down(100, 100, 2)).toBe('idle')
    pointer.down(100, 100)
    pointer.move(140, 100)
    pointer.cancel()
    frames.frame()
    expect(calls).toEqual(['begin c1', 'cancel'])
  })
})
