// Reconnect delay with "equal jitter": half the exponential step is fixed, half random, so a
// server restart does not get every client back in the same millisecond.
export const RECONNECT_BASE_MS = 200
export const RECONNECT_MAX_MS = 10_000

export function reconnectDelayMs(attempt: number, random: () => number, maxMs = RECONNECT_MAX_MS): number {
  const step = Math.min(maxMs, RECONNECT_BASE_MS * 2 ** Math.max(0, Math.min(attempt, 20)))
  return Math.round(step / 2 + random() * (step / 2))
}
