/**
 * Compile-time only: `npx tsc` fails when a zod shape in sheet-shapes.ts and its type in
 * electron/checklist/types.ts stop being assignable to each other (both ways), or when the store's
 * reading quantities, units or plan statuses drift from the checklist's. Nothing here runs.
 */
import type { z } from 'zod';
import type { PlanStatus as StorePlanStatus, readingQuantities, readingUnits } from '../../db/schema.js';
import type {
  Band,
  Diagram,
  ExpectedReading,
  PlanStatus,
  ReadingQuantity,
  Sheet,
  SheetHeader,
  SheetProgress,
  SheetStage,
  SheetStep,
  WorkshopUnit,
} from '../checklist/types.js';
import type * as shapes from './sheet-shapes.js';

/** true exactly when A and B are assignable to each other. */
type Same<A, B> = [A] extends [B] ? ([B] extends [A] ? true : false) : false;
type Assert<T extends true> = T;

export type SheetShapesMatchTheModel = [
  Assert<Same<z.infer<typeof shapes.sheet>, Sheet>>,
  Assert<Same<z.infer<typeof shapes.sheetHeader>, SheetHeader>>,
  Assert<Same<z.infer<typeof shapes.sheetStage>, SheetStage>>,
  Assert<Same<z.infer<typeof shapes.sheetStep>, SheetStep>>,
  Assert<Same<z.infer<typeof shapes.expectedReading>, ExpectedReading>>,
  Assert<Same<z.infer<typeof shapes.diagram>, Diagram>>,
  Assert<Same<z.infer<typeof shapes.sheetProgress>, SheetProgress>>,
  Assert<Same<z.infer<typeof shapes.band>, Band>>,
  Assert<Same<z.infer<typeof shapes.sheetPlanStatus>, PlanStatus>>,
  Assert<Same<z.infer<typeof shapes.sheetReadingQuantity>, ReadingQuantity>>,
  Assert<Same<z.infer<typeof shapes.workshopUnit>, WorkshopUnit>>,
];

export type StoreMatchesTheModel = [
  Assert<Same<(typeof readingQuantities)[number], ReadingQuantity>>,
  Assert<Same<(typeof readingUnits)[ReadingQuantity], WorkshopUnit>>,
  Assert<Same<StorePlanStatus, PlanStatus>>,
];
