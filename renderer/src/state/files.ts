/**
 * New, open, save, examples and recovery, all through the platform bridge (renderer/src/platform). Nothing the
 * user made is dropped without asking: every action that replaces the design asks first when there are unsaved
 * changes, and unsaved work is copied to the recovery store while editing.
 */
import { createAutosaver, type Autosaver, type Platform } from '../platform/index.ts';
import { newDesign } from '../../../core/index.ts';
import type { EditorState } from './editor.svelte.ts';
import { exampleText, EXAMPLES } from './examples.ts';

export type Ask = (title: string, message: string, choices: { id: string; label: string; primary?: boolean }[]) => Promise<string>;

export class FileActions {
  private readonly autosaver: Autosaver;

  constructor(private readonly editor: EditorState, private readonly platform: Platform, private readonly ask: Ask) {
    this.autosaver = createAutosaver({
      platform,
      snapshot: () => (editor.dirty ? { docId: editor.docId, name: editor.doc.name, path: editor.file?.path ?? null, text: editor.serialize() } : null),
      onError: (e) => { editor.status = `Recovery copy failed (${e.message}); save by hand to keep your work.`; },
      // Serialising a large design mid-drag costs pointer frames: the copy waits for the drag's end.
      holdWhile: () => editor.dragging,
    });
  }

  /** Call after every change of the design. */
  changed(): void {
    if (this.editor.dirty) this.autosaver.changed();
    // Tell the shell only when the title or the unsaved flag changes (not on every step of a drag).
    const state = { title: `${this.editor.doc.name} — Stripwright`, dirty: this.editor.dirty };
    if (state.title !== this.shown?.title || state.dirty !== this.shown?.dirty) {
      this.shown = state;
      void this.platform.setDocumentState(state);
    }
  }

  private shown: { title: string; dirty: boolean } | null = null;

  /** A design the OS or a second app instance asked to open. */
  async openHanded(d: { path: string; name: string; text: string; modifiedMs: number }): Promise<void> {
    if (!(await this.mayDiscard(`open ${d.name}`))) return;
    const err = this.editor.loadText(d.text, { path: d.path, name: d.name, modifiedMs: d.modifiedMs });
    if (err) await this.tell(`“${d.name}” is not a design this app can read`, `${err}\n\nYour current design is unchanged.`);
  }

  stop(): void { this.autosaver.stop(); }

  /** True when it is fine to replace the design: nothing unsaved, or the user saved or chose to discard. */
  async mayDiscard(action: string): Promise<boolean> {
    if (!this.editor.dirty) return true;
    const a = await this.ask('Unsaved changes', `“${this.editor.doc.name}” has changes that are not saved. Save them before you ${action}?`, [
      { id: 'cancel', label: 'Keep editing' }, { id: 'discard', label: 'Discard changes' }, { id: 'save', label: 'Save', primary: true },
    ]);
    if (a === 'save') return this.save();
    if (a === 'discard') { await this.platform.discardAutosave(this.editor.docId); this.autosaver.saved(); return true; }
    return false;
  }

  async newDesign(): Promise<void> {
    if (!(await this.mayDiscard('start a new design'))) return;
    this.editor.load(newDesign({ name: 'Untitled feed' }), null);
    this.editor.status = 'New design: place a port (P), then Route (R) from it.';
  }

  /** Called once an example is open (the App shows its notes). */
  onExampleOpened: (() => void) | null = null;

  async openExample(id: string): Promise<void> {
    const text = exampleText(id);
    if (!text) { this.editor.status = `No example “${id}”; the examples are ${EXAMPLES.map((e) => e.id).join(', ')}.`; return; }
    if (!(await this.mayDiscard('open an example'))) return;
    const err = this.editor.loadText(text, null);
    if (err) { this.editor.status = `The example could not be read: ${err}`; return; }
    this.editor.status = `Opened the example “${EXAMPLES.find((e) => e.id === id)?.title ?? id}” (not saved yet: Save as keeps your copy)`;
    this.onExampleOpened?.();
  }

  async open(): Promise<void> {
    if (!(await this.mayDiscard('open another design'))) return;
    const r = await this.platform.openDesign();
    if (!r.ok) { await this.tell('Could not open the file', r.error.message); return; }
    if (!r.value) return;
    const err = this.editor.loadText(r.value.text, { path: r.value.path, name: r.value.name, modifiedMs: r.value.modifiedMs });
    if (err) { await this.tell(`“${r.value.name}” is not a design this app can read`, `${err}\n\nYour current design is unchanged.`); return; }
    this.editor.status = `Opened ${r.value.name}`;
  }

  async save(): Promise<boolean> {
    const f = this.editor.file;
    if (!f) return this.saveAs();
    const r = await this.platform.saveDesign({ docId: this.editor.docId, path: f.path, text: this.editor.serialize(), expectedModifiedMs: f.modifiedMs });
    if (!r.ok) {
      const again = await this.ask('Not saved', `${r.error.message}\nSave under another name instead?`, [{ id: 'cancel', label: 'Cancel' }, { id: 'as', label: 'Save as…', primary: true }]);
      return again === 'as' ? this.saveAs() : false;
    }
    this.editor.markSaved({ path: r.value.path, name: r.value.name, modifiedMs: r.value.modifiedMs });
    this.autosaver.saved();
    this.editor.status = `Saved ${r.value.name}${r.value.backupPath ? ` (previous version kept as ${r.value.backupPath})` : ''}`;
    return true;
  }

  async saveAs(): Promise<boolean> {
    const name = this.editor.doc.name.replace(/[^\w .,-]+/g, ' ').trim().replace(/\s+/g, '-').toLowerCase() || 'design';
    const r = await this.platform.saveDesignAs({ docId: this.editor.docId, suggestedName: name, text: this.editor.serialize() });
    if (!r.ok) { await this.tell('Not saved', r.error.message); return false; }
    if (!r.value) return false;
    this.editor.markSaved({ path: r.value.path, name: r.value.name, modifiedMs: r.value.modifiedMs });
    this.autosaver.saved();
    this.editor.status = `Saved ${r.value.name}`;
    return true;
  }

  /** At start: offer recovery copies left by a session that ended without saving. */
  async offerRecovery(asked = false): Promise<void> {
    const r = await this.platform.checkRecovery();
    if (!r.ok) { if (asked) await this.tell('Could not look for recovery copies', r.error.message); return; }
    if (r.value.length === 0) { if (asked) await this.tell('Nothing to recover', 'No unsaved work from an earlier session was found.'); return; }
    if (!(await this.mayDiscard('restore earlier work'))) return;
    const e = r.value[0]!;
    const when = new Date(e.savedAt).toLocaleString();
    const a = await this.ask('Recover unsaved work?', `A copy of “${e.name}” from ${when} was not saved when the app last closed.`, [
      { id: 'later', label: 'Not now' }, { id: 'drop', label: 'Delete the copy' }, { id: 'restore', label: 'Restore', primary: true },
    ]);
    if (a === 'drop') { await this.platform.discardRecovery(e.docId); return; }
    if (a !== 'restore') return;
    const copy = await this.platform.readRecovery(e.docId);
    if (!copy.ok) { await this.tell('Could not read the copy', copy.error.message); return; }
    const err = this.editor.loadText(copy.value.text, null);
    if (err) { await this.tell('The copy could not be read', err); return; }
    // Restored work is unsaved until the user saves it; keep the copy until then.
    this.editor.markUnsaved();
    this.editor.status = `Restored “${e.name}”: save it to keep it.`;
  }

  private async tell(title: string, message: string): Promise<void> {
    await this.ask(title, message, [{ id: 'ok', label: 'OK', primary: true }]);
  }
}
