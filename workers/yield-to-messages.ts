/// <reference lib="webworker" />
// Lets a sliced worker run see messages (a cancel) between slices. A MessageChannel round trip
// is a macrotask without the 4 ms clamp of nested setTimeout.
const channel = new MessageChannel()
const waiting: (() => void)[] = []
channel.port1.onmessage = () => waiting.shift()?.()

export function yieldToMessages(): Promise<void> {
  return new Promise((resolve) => {
    waiting.push(resolve)
    channel.port2.postMessage(0)
  })
}
