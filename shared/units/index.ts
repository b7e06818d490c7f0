export * from './catalogue'
export * from './convert'
