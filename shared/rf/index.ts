// Public surface of the RF core. Import from here (`#shared/rf` in the app, a relative path elsewhere).
export * from './types'
export * from './errors'
export * from './complex'
export * from './elements'
export * from './ladder'
export * from './sweep'
export * from './gamma'
export * from './terminals'
