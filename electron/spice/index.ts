/** SPICE netlist export: one setup at one operating point -> an ngspice deck with `.meas` lines. */
export type { CdStage, DeckOptions, PrimarySide, Scenario, SecondarySide, SpiceCircuit } from './circuit.js';
export { circuitProblems, defaultCouplingK, defaultFouledShuntOhm, switchOutputCapacitanceF } from './circuit.js';
export type { SpiceDeck } from './decks.js';
export { DeckError, buildDeck, measureNames } from './decks.js';
export { spiceNumber } from './spice-number.js';
export { cdTransferHalfPeriodS, secondaryHalfPeriodS } from './timing.js';
export { secondaryInductanceH } from './secondary.js';
export { ExportError, circuitFromReport, switchCurrentLimitA } from './from-checker.js';
