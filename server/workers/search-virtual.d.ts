// The bundled match-search worker source nuxt.config.ts provides as a virtual module (bundle.ts).
declare module '#search-worker-source' {
  const source: string
  export default source
}
