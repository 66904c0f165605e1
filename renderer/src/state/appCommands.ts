/**
 * Every app command with its shortcut, for the keyboard, the menus and the command finder.
 */
import { BLOCKS } from '../../../core/index.ts';
import type { AppCommand } from './appCommand.ts';
import type { EditorState } from './editor.svelte.ts';
import type { FileActions } from './files.ts';
import { TOOLS } from '../board/tools.ts';
import { EXAMPLES } from './examples.ts';
import { CAUTIONS } from './cautions.ts';
import { APP_VERSION } from './editor.svelte.ts';

export interface ShellHooks {
  openFinder(): void;
  showDock(tab: string): void;
  tell(title: string, message: string): void;
  /** Opens the spec form of a block (coupled-line coupler, edge-coupled band-pass filter). */
  openBlock?(kind: 'coupler' | 'bandpass'): void;
  /** Opens the block picker on a kind of the registry (or a placed block's spec, with its id). */
  pickBlock?(kind: string, editId?: string): void;
  /** Writes the design report (PDF) at once through the platform (state/report.ts); without it, Outputs opens. */
  writeReport?(): void;
}

export function appCommands(ed: EditorState, files: FileActions, shell: ShellHooks): AppCommand[] {
  const sel = () => ed.selection.size > 0;
  const list: AppCommand[] = [
    { id: 'file.new', group: 'File', label: 'New design', keys: ['Mod+Alt+N'], run: () => files.newDesign() },
    { id: 'file.open', group: 'File', label: 'Open design…', keys: ['Mod+O'], run: () => files.open() },
    { id: 'file.save', group: 'File', label: 'Save', keys: ['Mod+S'], run: async () => { await files.save(); } },
    { id: 'file.save-as', group: 'File', label: 'Save as…', keys: ['Mod+Shift+S'], run: async () => { await files.saveAs(); } },
    { id: 'file.export', group: 'File', label: 'Outputs for the shop (DXF, SVG, Gerber, drill, mask)', keys: ['Mod+E'], run: () => shell.showDock('outputs') },
    { id: 'edit.undo', group: 'Edit', label: 'Undo', keys: ['Mod+Z'], enabled: () => ed.canUndo, run: () => ed.undo() },
    { id: 'edit.redo', group: 'Edit', label: 'Redo', keys: ['Mod+Shift+Z', 'Mod+Y'], enabled: () => ed.canRedo, run: () => ed.redo() },
    { id: 'edit.delete', group: 'Edit', label: 'Delete selection', keys: ['Delete', 'Backspace'], enabled: sel, run: () => ed.deleteSelection() },
    { id: 'edit.copy', group: 'Edit', label: 'Copy', keys: ['Mod+C'], enabled: sel, run: () => { ed.copy(); } },
    { id: 'edit.cut', group: 'Edit', label: 'Cut', keys: ['Mod+X'], enabled: sel, run: () => ed.cut() },
    { id: 'edit.paste', group: 'Edit', label: 'Paste', keys: ['Mod+V'], run: () => ed.paste() },
    { id: 'edit.select-all', group: 'Edit', label: 'Select everything', keys: ['Mod+A'], run: () => ed.selectAll() },
    { id: 'edit.select-none', group: 'Edit', label: 'Drop selection / stop drawing', keys: ['Escape'], run: () => { if (ed.tools.busy) ed.tools.cancel(); else ed.select([]); } },
    { id: 'edit.rotate', group: 'Edit', label: 'Turn selection 90° anticlockwise', keys: ['Q'], enabled: sel, run: () => ed.rotateSelection(90) },
    { id: 'edit.rotate-back', group: 'Edit', label: 'Turn selection 90° clockwise', keys: ['Shift+Q'], enabled: sel, run: () => ed.rotateSelection(-90) },
    { id: 'edit.mirror', group: 'Edit', label: 'Mirror selection left–right', keys: ['M'], enabled: sel, run: () => ed.mirrorSelection('vertical') },
    { id: 'edit.mirror-v', group: 'Edit', label: 'Mirror selection top–bottom', keys: ['Shift+M'], enabled: sel, run: () => ed.mirrorSelection('horizontal') },
    { id: 'draw.finish', group: 'Draw', label: 'Finish the run or board edge', keys: ['Enter'], enabled: () => ed.tools.busy, run: () => ed.tools.finish() },
    { id: 'view.zoom-in', group: 'View', label: 'Zoom in', keys: ['=', '+'], run: () => ed.board?.zoomBy(1.4) },
    { id: 'view.zoom-out', group: 'View', label: 'Zoom out', keys: ['-'], run: () => ed.board?.zoomBy(1 / 1.4) },
    { id: 'view.zoom-fit', group: 'View', label: 'Zoom to fit', keys: ['F', 'Home'], run: () => ed.fitAll() },
    { id: 'view.zoom-selection', group: 'View', label: 'Zoom to the selection', keys: ['Shift+F'], enabled: sel, run: () => ed.selectAndFrame([...ed.selection]) },
    { id: 'view.units', group: 'View', label: 'Switch units mm / mil', keys: ['U'], run: () => ed.setUnits(ed.units === 'mm' ? 'mil' : 'mm') },
    { id: 'view.grid-finer', group: 'View', label: 'Finer snap grid', keys: ['['], run: () => ed.setGrid(Math.max(ed.gridStep / 2, 1e-6)) },
    { id: 'view.grid-coarser', group: 'View', label: 'Coarser snap grid', keys: [']'], run: () => ed.setGrid(Math.min(ed.gridStep * 2, 0.01)) },
    { id: 'view.theme', group: 'View', label: 'Light or dark theme', keys: ['Mod+Shift+L'], run: () => ed.toggleTheme() },
    { id: 'view.finder', group: 'View', label: 'Find a command', keys: ['Mod+K', 'F1'], run: () => shell.openFinder() },
    { id: 'view.paths', group: 'Board', label: 'Show the path ledger', keys: ['Alt+1'], run: () => shell.showDock('paths') },
    { id: 'view.findings', group: 'Board', label: 'Show the shop check', keys: ['Alt+2'], run: () => shell.showDock('findings') },
    { id: 'view.response', group: 'Board', label: 'Show the response', keys: ['Alt+3'], run: () => shell.showDock('response') },
    { id: 'view.measured', group: 'Board', label: 'Measured data beside the simulation (Touchstone overlay)', run: () => shell.showDock('measured') },
    { id: 'file.report', group: 'File', label: 'Write the design report (PDF)…', run: () => (shell.writeReport ? shell.writeReport() : shell.showDock('outputs')) },
    { id: 'board.coupon', group: 'Board', label: 'Add a laminate coupon to the board', run: () => { const r = ed.addCoupon(); if (typeof r === 'string') shell.tell('Laminate coupon', r); } },
    { id: 'view.notes', group: 'Board', label: 'Show the design\'s notes (what it is for, targets, scenario)', run: () => shell.showDock('notes') },
    { id: 'view.laminate', group: 'Board', label: 'Laminate from a coupon: open its tab', run: () => shell.showDock('laminate') },
    { id: 'file.recover', group: 'File', label: 'Recover unsaved work from an earlier session', run: () => files.offerRecovery(true) },
    { id: 'edit.rename', group: 'Edit', label: 'Rename the design', run: () => (document.querySelector('[data-testid="design-name"]') as HTMLElement | null)?.click() },
    { id: 'help.cautions', group: 'Help', label: 'Safety cautions', run: () => shell.tell('Safety cautions', CAUTIONS) },
    { id: 'help.about', group: 'Help', label: 'About Stripwright', run: () => shell.tell('Stripwright', `Version ${APP_VERSION}. Sketch, size, check and export microstrip feed networks for boards made in-house.`) },
  ];
  if (shell.pickBlock) {
    const pick = shell.pickBlock;
    list.push({ id: 'block.pick', group: 'Blocks', label: 'Place a block from a spec…', run: () => pick('corporate') });
    for (const b of BLOCKS) list.push({ id: `block.${b.kind}`, group: 'Blocks', label: `Place a block: ${b.title.toLowerCase()} (${b.kind})…`, run: () => pick(b.kind) });
  }
  if (shell.openBlock) {
    const open = shell.openBlock;
    list.push({ id: 'block.coupler', group: 'Blocks', label: 'Place a coupled-line coupler…', run: () => open('coupler') });
    list.push({ id: 'block.bandpass', group: 'Blocks', label: 'Place an edge-coupled band-pass filter…', run: () => open('bandpass') });
  }
  for (const t of TOOLS) list.push({ id: `tool.${t.id}`, group: 'Draw', label: `Tool: ${t.label}`, keys: [t.key], run: () => ed.setTool(t.id) });
  for (const ex of EXAMPLES) list.push({ id: `example.${ex.id}`, group: 'File', label: `Open example: ${ex.title}`, run: () => files.openExample(ex.id) });
  return list;
}
