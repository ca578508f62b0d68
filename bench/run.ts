// `npm run bench` (tsx bench/run.ts): runs every benchmark module below in turn and prints its
// figures; `npm run bench -- rf touchstone` runs only the named ones. To add a module, append one
// entry to BENCH_MODULES: a name and a run() that imports the module lazily (so a module that needs
// a built server or a browser costs nothing when it is not selected) and prints its results.
// A module that fails is reported and the others still run; the exit code is then 1.

type BenchModule = { readonly name: string; readonly needs?: string; readonly run: () => Promise<void> }

export const BENCH_MODULES: BenchModule[] = [
  {
    name: 'rf',
    run: async () => {
      const m = await import('./rf')
      m.printRfBench(m.runRfBench())
    },
  },
  {
    name: 'models',
    run: async () => {
      const m = await import('./models')
      m.printModelsBench(m.runModelsBench())
    },
  },
  {
    name: 'amplifier',
    run: async () => {
      const m = await import('./amplifier')
      m.printAmplifierBench(m.runAmplifierBench())
    },
  },
  {
    name: 'touchstone',
    run: async () => {
      const m = await import('./touchstone')
      m.printTouchstoneBench(m.runTouchstoneBench())
    },
  },
  {
    name: 'live',
    needs: 'a build (bash scripts/build.sh) and Debian\'s postgresql and redis-server for the two-node part',
    run: async () => {
      const m = await import('./live')
      m.printLiveBench(await m.runLiveBench())
    },
  },
  {
    name: 'flood',
    needs: 'a build (bash scripts/build.sh)',
    run: async () => {
      const m = await import('./flood')
      m.printFloodBenches(await m.runFloodBench())
    },
  },
  {
    name: 'drag',
    needs: 'a build (bash scripts/build.sh) and /usr/bin/chromium',
    run: async () => {
      const m = await import('./drag')
      m.printDragBench(await m.runDragBench())
    },
  },
  {
    name: 'montecarlo',
    needs: 'a build (bash scripts/build.sh) and /usr/bin/chromium for the worker part',
    run: async () => {
      const m = await import('./montecarlo')
      m.printMonteCarloBench(await m.runMonteCarloBench())
    },
  },
  {
    name: 'search',
    needs: 'the system cc; a build (bash scripts/build.sh) and /usr/bin/chromium for the worker and live parts',
    run: async () => {
      const m = await import('./search')
      m.printSearchBench(m.runSearchBench())
      const live = await import('./search-live')
      live.printSearchLiveBench(await live.runSearchLiveBench())
    },
  },
]

async function main(): Promise<void> {
  const wanted = process.argv.slice(2)
  const unknown = wanted.filter((w) => !BENCH_MODULES.some((m) => m.name === w))
  if (unknown.length > 0) {
    console.error(`unknown bench module(s): ${unknown.join(', ')} (known: ${BENCH_MODULES.map((m) => m.name).join(', ')})`)
    process.exit(2)
  }
  const selected = wanted.length === 0 ? BENCH_MODULES : BENCH_MODULES.filter((m) => wanted.includes(m.name))
  let failed = 0
  for (const module of selected) {
    const start = performance.now()
    console.log(`== ${module.name}${module.needs ? ` (needs ${module.needs})` : ''}`)
    try {
      await module.run()
      console.log(`   (${((performance.now() - start) / 1000).toFixed(1)} s)`)
    } catch (error) {
      failed++
      console.error(`${module.name}: failed: ${error instanceof Error ? error.message : String(error)}`)
    }
  }
  process.exitCode = failed > 0 ? 1 : 0
}

void main()
