/**
 * The path ledger's Equalize button: runs `equalizeGroup` in the compute worker (on the pieces the user picked, or
 * those the tool chooses) and applies the result as one undo step (the design command 'network.equalize'), or shows why it could not (no room: how much is missing).
 */
import type { EditorState } from './editor.svelte.ts';
import type { Compute } from './compute.svelte.ts';
import type { EqualizeOutput } from '../worker/equalize-job.ts';
import type { MeanderStyle } from '../../../core/index.ts';

export interface EqualizeView { group: string; busy: boolean; failed: boolean; lines: string[] }

/**
 * `pieces`: the segments the user picked to carry the meanders (default: the tool chooses); `style`: the meander
 * shape (auto, serpentine or trombone, the same choice as the CLI's `--style`).
 */
export async function equalizeInLedger(editor: EditorState, compute: Compute, group: string, show: (v: EqualizeView) => void, pieces?: string[], style: MeanderStyle = 'auto'): Promise<void> {
  show({ group, busy: true, failed: false, lines: ['Equalizing…'] });
  const out = await compute.run<EqualizeOutput>('equalize', { doc: editor.doc, group, style, ...(pieces ? { pieces: [...pieces] } : {}) });
  if (out.ok) {
    if (out.value.lines.length > 1 || out.value.nodes.length !== editor.doc.nodes.length) {
      editor.edit('network.equalize', { nodes: out.value.nodes, segments: out.value.segments }, 'Equalize phase group');
    }
    show({ group, busy: false, failed: false, lines: out.value.lines });
  } else if ('error' in out) {
    show({ group, busy: false, failed: true, lines: [`Not equalized: ${out.error.got ?? out.error.message}`] });
  } else {
    show({ group, busy: false, failed: false, lines: [] });
  }
}
