/**
 * The one API the renderer sees, exposed through contextBridge. It grows with the app; its type is
 * shared with the renderer through src/shared/appApi.ts.
 */
import { contextBridge } from 'electron';
import type { AppApi } from '../shared/appApi';

const api: AppApi = {
  host: 'electron',
  versions: { electron: process.versions.electron ?? 'unknown', chrome: process.versions.chrome ?? 'unknown' },
};

contextBridge.exposeInMainWorld('setpointCritic', api);
