// The engine's public surface. Each module adds its own export line here.
export * from './network/model.js';
export * from './elements/two-port-law.js';
export * from './units/number-text.js';
export * from './units/quantity.js';
export * from './units/format-quantity.js';
export * from './air/standard-air.js';
export * from './air/ambient.js';
export * from './air/density.js';
export * from './air/viscosity.js';
export * from './air/flow-basis.js';
