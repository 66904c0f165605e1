/**
 * The native menu as a template of plain data: our own commands are sent to the page as MENU_COMMANDS ids (the
 * renderer's command registry runs them, so a menu item and a shortcut are one command); clipboard items use
 * Electron's roles so they work in text fields. Tested without Electron.
 */
import type { MenuItemConstructorOptions } from 'electron';
import type { MenuCommandId, RecentFile } from '../bridge/contract.ts';

export interface MenuActions {
  command(id: MenuCommandId): void;
  openRecent(path: string): void;
  clearRecent(): void;
  showRecoveryFolder(): void;
  /** Native message boxes, so they work even when the page does not. */
  showCautions(): void;
  showAbout(): void;
}

/** True when an accelerator has a modifier (a bare key like 'F' or '=' must never be taken from text fields). */
const hasModifier = (a: string) => /(Cmd|Ctrl|CmdOrCtrl|Command|Control|Alt|Option|Super|Meta)\+/.test(a);

export function menuTemplate(a: MenuActions, recent: RecentFile[], platform: string = process.platform, o: { development?: boolean } = {}): MenuItemConstructorOptions[] {
  const mac = platform === 'darwin';
  // The page's command registry owns the keys (it knows whether a text field has the focus), so the menu shows
  // them without registering them (Linux, Windows). macOS menus always own their key equivalents, so there bare keys
  // are left out of the menu and only keys with a modifier are given.
  const cmd = (label: string, id: MenuCommandId, accelerator?: string): MenuItemConstructorOptions => {
    const item: MenuItemConstructorOptions = { label, click: () => a.command(id) };
    if (accelerator && (!mac || hasModifier(accelerator))) { item.accelerator = accelerator; if (!mac) item.registerAccelerator = false; }
    return item;
  };
  const recentItems: MenuItemConstructorOptions[] = recent.length
    ? [...recent.map((r) => ({ label: r.name, sublabel: r.path, click: () => a.openRecent(r.path) })), { type: 'separator' as const }, { label: 'Clear List', click: () => a.clearRecent() }]
    : [{ label: 'No Recent Designs', enabled: false }];
  return [
    ...(mac ? [{ role: 'appMenu' as const }] : []),
    {
      label: '&File',
      submenu: [
        cmd('&New Design', 'file.new', 'CmdOrCtrl+Alt+N'),
        cmd('&Open…', 'file.open', 'CmdOrCtrl+O'),
        { label: 'Open &Recent', submenu: recentItems },
        { type: 'separator' },
        cmd('&Save', 'file.save', 'CmdOrCtrl+S'),
        cmd('Save &As…', 'file.save-as', 'CmdOrCtrl+Shift+S'),
        cmd('&Export…', 'file.export', 'CmdOrCtrl+E'),
        cmd('Design Re&port (PDF)…', 'file.report'),
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
        cmd('&Undo', 'edit.undo', 'CmdOrCtrl+Z'),
        cmd('&Redo', 'edit.redo', 'CmdOrCtrl+Shift+Z'),
        { type: 'separator' },
        { role: 'cut' }, { role: 'copy' }, { role: 'paste' },
        cmd('&Delete', 'edit.delete', 'Delete'),
        cmd('Select &All', 'edit.select-all', 'CmdOrCtrl+A'),
      ],
    },
    {
      label: '&View',
      submenu: [
        cmd('Zoom &In', 'view.zoom-in', '='),
        cmd('Zoom &Out', 'view.zoom-out', '-'),
        cmd('&Fit Board', 'view.zoom-fit', 'F'),
        { type: 'separator' },
        { role: 'togglefullscreen' },
        // Developer tools only when run from source (policy.ts devToolsAllowed).
        ...(o.development ? [{ role: 'toggleDevTools' as const }] : []),
      ],
    },
    {
      label: '&Help',
      submenu: [{ label: 'Safety &Cautions', click: () => a.showCautions() }, { label: '&About Stripwright', click: () => a.showAbout() }],
    },
  ];
}
