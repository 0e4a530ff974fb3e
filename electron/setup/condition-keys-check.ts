/**
 * Compile-time only: the working conditions the store lets a person set (db/conditions.ts) are
 * exactly the checker's ConditionName, no more and no fewer. Adding a condition to one side and
 * not the other fails `npx tsc`. Nothing here runs.
 */
import type { ConditionKey } from '../../db/schema.js';
import type { ConditionName } from '../checker/types.js';

type Same<A, B> = [A] extends [B] ? ([B] extends [A] ? true : false) : false;

/** True only when the two key lists are the same set. */
export const conditionKeysMatchTheChecker: Same<ConditionKey, ConditionName> = true;
