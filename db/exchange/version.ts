/** The store's schema version written into an export (informative; the file has its own version). */
import { migrations } from '../migrations/index.js';

export const SCHEMA_VERSION_FOR_EXPORT: number = migrations.length;
