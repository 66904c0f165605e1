/**
 * The native menu as a template of plain data: our own commands are sent to the page as MENU_COMMANDS ids (the
 * renderer's command registry runs them, so a menu item and a shortcut are one command); clipboard items use
 * Electron's roles so they work in text fields. Tested without Electron.
 */
import type { MenuItemConstructorOptions } from 'electron';
import type { MenuCommandId, RecentFile } from './contract.ts';

export interface MenuActions {
  command(id: MenuCommandId): void;
  openRecent(path: string): void;
  clearRecent(): void;
  showRecoveryFolder(): void;
}

export function menuTemplate(a: MenuActions, recent: RecentFile[], platform: string = process.platform): MenuItemConstructorOptions[] {
  const cmd = (label: string, id: MenuCommandId, accelerator?: string): MenuItemConstructorOptions => ({ label, ...(accelerator ? { accelerator } : {}), click: () => a.command(id) });
  // Edit keys stay with the page (it knows whether a text field has the focus): shown, not registered.
  const pageKey = (label: string, id: MenuCommandId, accelerator: string): MenuItemConstructorOptions => ({ ...cmd(label, id, accelerator), registerAccelerator: false });
  const mac = platform === 'darwin';
  const recentItems: MenuItemConstructorOptions[] = recent.length
    ? [...recent.map((r) => ({ label: r.name, sublabel: r.path, click: () => a.openRecent(r.path) })), { type: 'separator' as const }, { label: 'Clear List', click: () => a.clearRecent() }]
    : [{ label: 'No Recent Designs', enabled: false }];
  return [
    ...(mac ? [{ role: 'appMenu' as const }] : []),
    {
      label: '&File',
      submenu: [
        cmd('&New Design', 'file.new', 'CmdOrCtrl+N'),
        cmd('&Open…', 'file.open', 'CmdOrCtrl+O'),
        { label: 'Open &Recent', submenu: recentItems },
        { type: 'separator' },
        cmd('&Save', 'file.save', 'CmdOrCtrl+S'),
        cmd('Save &As…', 'file.save-as', 'CmdOrCtrl+Shift+S'),
        cmd('&Export…', 'file.export', 'CmdOrCtrl+E'),
        { type: 'separator' },
        cmd('Restore Unsaved Work…', 'file.recover'),
        { label: 'Show Recovery Folder', click: () => a.showRecoveryFolder() },
        { type: 'separator' },
        mac ? { role: 'close' } : { role: 'quit', label: 'E&xit' },
      ],
    },
    {
      label: '&Edit',
      submenu: [
        pageKey('&Undo', 'edit.undo', 'CmdOrCtrl+Z'),
        pageKey('&Redo', 'edit.redo', mac ? 'Cmd+Shift+Z' : 'Ctrl+Y'),
        { type: 'separator' },
        { role: 'cut' }, { role: 'copy' }, { role: 'paste' },
        pageKey('&Delete', 'edit.delete', 'Delete'),
        pageKey('Select &All', 'edit.select-all', 'CmdOrCtrl+A'),
      ],
    },
    {
      label: '&View',
      submenu: [
        cmd('Zoom &In', 'view.zoom-in', 'CmdOrCtrl+='),
        cmd('Zoom &Out', 'view.zoom-out', 'CmdOrCtrl+-'),
        cmd('&Fit Board', 'view.zoom-fit', 'CmdOrCtrl+0'),
        { type: 'separator' },
        { role: 'togglefullscreen' },
        { role: 'toggleDevTools' },
      ],
    },
    {
      label: '&Help',
      submenu: [cmd('Safety &Cautions', 'help.cautions'), cmd('&About Stripwright', 'help.about')],
    },
  ];
}
