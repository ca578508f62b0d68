// Build step for the server's worker threads: Nitro bundles one entry (index.mjs) and has no
// notion of a worker file, so each worker is bundled here with esbuild into a self-contained
// CommonJS string, served to the server code as a virtual module and started with
// `new Worker(source, { eval: true })`. Used from nuxt.config.ts (nitro.virtual).
import { build } from 'esbuild'

/** The `export default "<worker source>"` module text for the worker entry at `entry`. */
export async function workerSourceModule(entry: string): Promise<string> {
  const result = await build({
    entryPoints: [entry],
    bundle: true,
    write: false,
    platform: 'node',
    format: 'cjs',
    target: 'node20',
    logLevel: 'warning',
  })
  return `export default ${JSON.stringify(result.outputFiles[0]!.text)}`
}
