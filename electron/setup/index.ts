/**
 * The adapter between the store and the checker: stored engines, parts, plans and readings in,
 * the checker's plain inputs out. This is the only place that knows both shapes.
 */
export { engineSpec, conditionInputs } from './engine.js';
export { coilSpec, ballastSpec, moduleSpec, tachSpec, leadsSpec, plugSpec, latestReading, defaultHarnessWire, partOf } from './parts.js';
export { existingSetupSpec, planSetupSpec, comparisonInput, searchInput, defaultMagnetoArmature } from './setups.js';
export { sheetInput } from './sheet.js';
export { SetupAdapterError, type SetupErrorCode } from './errors.js';
