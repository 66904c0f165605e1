// "Unsaved" means the design differs from what was last opened or saved, not merely that something was edited:
// undoing back to the saved state clears it, redoing sets it again (common practice of desktop editors).
import { describe, expect, it } from 'vitest';
import { flushSync } from 'svelte';
import { EditorState } from '../../renderer/src/state/editor.svelte.ts';
import { editorOn } from './harness.ts';
import { exampleText } from '../../renderer/src/state/examples.ts';

describe('unsaved changes', () => {
  it('an edit marks the design unsaved, undoing back clears it, redo and a second edit set it again', () => {
    const ed = editorOn('demo');
    flushSync();
    expect(ed.dirty).toBe(false);
    ed.rename('Renamed once');
    flushSync();
    expect(ed.dirty).toBe(true);
    ed.undo();
    flushSync();
    expect(ed.dirty).toBe(false);
    ed.redo();
    flushSync();
    expect(ed.dirty).toBe(true);
  });

  it('after a save the saved state is the new reference', () => {
    const ed = new EditorState();
    ed.loadText(exampleText('demo')!, null);
    ed.rename('Saved name');
    flushSync();
    ed.markSaved({ name: 'demo.stripwright', path: null } as never);
    flushSync();
    expect(ed.dirty).toBe(false);
    ed.undo();
    flushSync();
    expect(ed.dirty).toBe(true);
  });

  it('editing a record and undoing it restores the saved state (records compared, not just counters)', () => {
    const ed = new EditorState();
    ed.loadText(exampleText('demo')!, null);
    ed.updateSegment('feed', { width: { by: 'z0', z0: 60 } });
    flushSync();
    expect(ed.doc.segments.find((s) => s.id === 'feed')).toMatchObject({ width: { by: 'z0', z0: 60 } });
    expect(ed.dirty).toBe(true);
    ed.undo();
    flushSync();
    expect(ed.dirty).toBe(false);
  });

  it('a design restored from a recovery copy counts as unsaved until it is saved', () => {
    const ed = new EditorState();
    ed.loadText(exampleText('demo')!, null);
    ed.markUnsaved();
    flushSync();
    expect(ed.dirty).toBe(true);
  });
});
