// The layer rule of DEVELOPERS.md, checked on the sources: imports point one way. Client code
// (components, pages, composables, stores, plugins) never imports server code; composables never
// reach up into stores (neither by import nor through Nuxt's auto-imported use…Store); shared/
// never imports Vue, Pinia, Konva, h3, Sequelize or a Nuxt alias outside shared/.
import { readdirSync, readFileSync, statSync } from 'node:fs'
import { join, relative } from 'node:path'
import { describe, expect, it } from 'vitest'

const root = join(__dirname, '..', '..')

function sources(folder: string): string[] {
  const out: string[] = []
  const walk = (dir: string) => {
    for (const name of readdirSync(dir)) {
      const path = join(dir, name)
      if (statSync(path).isDirectory()) walk(path)
      else if (/\.(ts|vue)$/.test(name)) out.push(path)
    }
  }
  walk(join(root, folder))
  return out
}

/** Every module specifier a file imports (static, dynamic and re-exports). */
function importsOf(file: string): string[] {
  const text = readFileSync(file, 'utf8')
  return [...text.matchAll(/(?:import|export)[^'"]*?from\s*['"]([^'"]+)['"]|import\(\s*['"]([^'"]+)['"]\s*\)/g)].map(m => m[1] ?? m[2]!)
}

function offenders(folders: string[], isWrong: (specifier: string, text: string) => boolean): string[] {
  return folders.flatMap(sources).flatMap((file) => {
    const text = readFileSync(file, 'utf8')
    return importsOf(file).filter(s => isWrong(s, text)).map(s => `${relative(root, file)} → ${s}`)
  })
}

describe('layers', () => {
  it('client code never imports server code', () => {
    expect(offenders(['components', 'pages', 'composables', 'stores', 'plugins', 'shared'], s => /(^|\/|~\/)server\//.test(s))).toEqual([])
  })

  it('composables never import stores', () => {
    expect(offenders(['composables'], s => /(^|\/|~\/)stores\//.test(s))).toEqual([])
    const autoImported = sources('composables').filter(f => /\buse[A-Z]\w*Store\s*\(/.test(readFileSync(f, 'utf8')))
    expect(autoImported.map(f => relative(root, f))).toEqual([])
  })

  it('shared code imports no framework, database or client alias', () => {
    expect(offenders(['shared'], s => /^(vue|pinia|konva|vue-konva|h3|sequelize|nuxt|#app|#imports|~|~~)(\/|$)/.test(s))).toEqual([])
  })

  it('shared/rf imports only relative paths and npm packages', () => {
    expect(offenders(['shared/rf'], s => s.startsWith('#') || s.startsWith('~'))).toEqual([])
  })
})
