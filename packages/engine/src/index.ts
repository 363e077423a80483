// The engine's public surface. Each module adds its own export line here.
export * from './network/model.js';
export * from './elements/two-port-law.js';
