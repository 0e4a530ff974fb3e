/**
 * The wiring sheet's shapes as the renderer sees them: the types of the 'sheet.get' answer from
 * the channel map (electron/ipc/channels.ts re-exports the zod shapes of the sheet model in
 * electron/checklist/types.ts). Types only: nothing here reaches the bundle.
 */
import type { JudgedReading as ChannelJudged, SheetAnswer } from '../../electron/ipc/channels.js';

export type Sheet = SheetAnswer['sheet'];
export type SheetHeader = Sheet['header'];
export type SheetStage = Sheet['stages'][number];
export type SheetStep = SheetStage['steps'][number];
export type ExpectedReading = NonNullable<SheetStep['reading']>;
export type Diagram = Sheet['diagram'];
export type DiagramPart = Diagram['parts'][number];
export type DiagramTerminal = DiagramPart['terminals'][number];
export type DiagramWire = Diagram['wires'][number];
export type WireStyle = DiagramWire['style'];
export type PlanStatus = SheetHeader['plan']['status'];
export type VerdictValue = SheetHeader['verdict']['verdict'];
export type SheetProgress = SheetAnswer['progress'];
/** A reading already taken, judged against its step (from 'sheet.get' `judged`). */
export type JudgedReading = ChannelJudged;
export type Band = JudgedReading['band'];
