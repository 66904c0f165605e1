/**
 * What the component tests share: an editor on one of the bundled examples, and the layout the worker would send
 * for its current revision, computed inline with the same job function.
 */
import { expect } from 'vitest';
import { flushSync } from 'svelte';
import { EditorState } from '../../renderer/src/state/editor.svelte.ts';
import { exampleText } from '../../renderer/src/state/examples.ts';
import { layoutJob } from '../../renderer/src/worker/jobs.ts';
import { figuresFrom, placedFrom } from '../../renderer/src/state/layoutView.ts';

/** A new editor with the bundled example `id` loaded (the test fails if it does not load). */
export function editorOn(id: string): EditorState {
  const ed = new EditorState();
  expect(ed.loadText(exampleText(id)!, null)).toBeNull();
  return ed;
}

/** Sizes the editor's design as the worker would (with phase sensitivities when asked) and applies the result. */
export async function sized(ed: EditorState, opts: { sensitivities?: boolean } = {}): Promise<void> {
  const out = await layoutJob({ doc: ed.doc, ...opts }, () => {});
  ed.applyLayout({ revision: ed.revision, sized: out.sized, outlines: out.outlines, drills: out.drills, paths: out.paths, placed: placedFrom(out.sized), figures: figuresFrom(out.sized), ms: 0 }, out.geometryError);
  flushSync();
}
