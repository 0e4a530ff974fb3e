/**
 * The wiring sheet: a weighed plan turned into what a restorer takes to the car. Pure: it imports
 * only electron/checklist, electron/checker and electron/safety (test/checklist/purity.test.ts).
 *
 * - `buildSheet`       SheetInput -> Sheet (header, cautions, stages of steps, diagram)
 * - `judgeReading`     a value against a step's band ('in' when min <= value <= max)
 * - `sheetProgress`    ticks and the latest reading per quantity -> how far the work has come
 * - `stepForQuantity`  the one step that asks for a quantity
 */
export * from './types.js';
export { buildSheet } from './sheet.js';
export { judgeReading, sheetProgress, stepForQuantity } from './progress.js';
export { SheetInputError } from './errors.js';
export { QUANTITY_UNITS } from './units.js';
