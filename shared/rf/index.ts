// Public surface of the RF core. Import from here (`#shared/rf` in the app, a relative path elsewhere).
export * from './types'
export * from './errors'
