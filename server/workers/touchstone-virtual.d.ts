// The bundled Touchstone reader worker source nuxt.config.ts provides as a virtual module (bundle.ts).
declare module '#touchstone-worker-source' {
  const source: string
  export default source
}
