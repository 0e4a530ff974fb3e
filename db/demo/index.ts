/** The invented demo workshop: its parts bin, engines and plans, and the two ways of loading it. */
export { loadDemo, loadDemoIfFirstRun, DEMO_FLAG, type DemoCounts } from './load.js';
export { demoParts } from './parts.js';
export { demoEngines, DEMO_WORKSHOP_NAME, type DemoEngine } from './engines.js';
export { demoPlans, type DemoPlan } from './plans.js';
export { resolveDemoEngine, resolveDemoPlan, type PartRef } from './resolve.js';
