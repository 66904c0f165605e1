// Preload bridge (filled in by the desktop-shell work): the only surface the renderer sees.
import { contextBridge } from 'electron';

contextBridge.exposeInMainWorld('stripwright', { shell: 'electron' as const });
