/**
 * The desktop bridge. The sandboxed page gets exactly one object: one async function per channel
 * of the map, each forwarding its request to the main process and resolving to a `Result`. No
 * ipcRenderer, no event emitter, no callbacks and no way to name a channel that is not in the map.
 * `satisfies BridgeApi` makes the compiler fail if a channel is missing or an extra one appears.
 */
import { contextBridge, ipcRenderer } from 'electron';
import { bridgeGlobalName, type BridgeApi, type ChannelName, type RequestOf, type ResponseOf, type Result } from './ipc/channels.js';

function call<C extends ChannelName>(channel: C): (request: RequestOf<C>) => Promise<Result<ResponseOf<C>>> {
  // Only the request crosses; it is structured-cloned, so no function or prototype survives.
  return (request) => ipcRenderer.invoke(channel, request) as Promise<Result<ResponseOf<C>>>;
}

const bridge = {
  'app.info': call('app.info'),
  'demo.load': call('demo.load'),
  'engines.list': call('engines.list'),
  'engines.get': call('engines.get'),
  'engines.create': call('engines.create'),
  'engines.update': call('engines.update'),
  'engines.delete': call('engines.delete'),
  'parts.list': call('parts.list'),
  'parts.get': call('parts.get'),
  'parts.create': call('parts.create'),
  'parts.update': call('parts.update'),
  'parts.delete': call('parts.delete'),
  'plans.list': call('plans.list'),
  'plans.get': call('plans.get'),
  'plans.create': call('plans.create'),
  'plans.update': call('plans.update'),
  'plans.delete': call('plans.delete'),
  'readings.list': call('readings.list'),
  'readings.add': call('readings.add'),
  'readings.delete': call('readings.delete'),
  'readings.update': call('readings.update'),
  'plans.setStatus': call('plans.setStatus'),
  'store.unreadable': call('store.unreadable'),
  'engines.contents': call('engines.contents'),
  'parts.usedBy': call('parts.usedBy'),
  'removed.list': call('removed.list'),
  'removed.restore': call('removed.restore'),
  'settings.get': call('settings.get'),
  'settings.set': call('settings.set'),
  'check.cancel': call('check.cancel'),
  'check.progress': call('check.progress'),
  'sheet.get': call('sheet.get'),
  'sheet.tick': call('sheet.tick'),
  'app.print': call('app.print'),
  'check.plans': call('check.plans'),
  'check.search': call('check.search'),
  'backup.create': call('backup.create'),
  'backup.list': call('backup.list'),
  'backup.restore': call('backup.restore'),
  'workshop.export': call('workshop.export'),
  'workshop.importPreview': call('workshop.importPreview'),
  'workshop.import': call('workshop.import'),
  'parts.csvExport': call('parts.csvExport'),
  'parts.csvImportPreview': call('parts.csvImportPreview'),
  'parts.csvImport': call('parts.csvImport'),
} satisfies BridgeApi;

contextBridge.exposeInMainWorld(bridgeGlobalName, Object.freeze(bridge));
