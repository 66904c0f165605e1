/** Small invented boards for the toolpath tests (not real designs). */
import type { DesignDoc, FabProcess } from '../../core/index.ts';
import { design, port, open, line, wd, lenOf } from './layout-fixtures.ts';

const FR4 = { er: 4.4, h: 1.6e-3, t: 35e-6, tanDelta: 0.02, sigma: 5.8e7, roughness: 0 };

/** Two parallel strips of widths w1, w2 (m), `gap` apart, each from a port to an open end. */
export function twoStrips(w1: number, w2: number, gap: number, process: FabProcess, length = 12e-3): DesignDoc {
  const y2 = w1 / 2 + gap + w2 / 2;
  return design({
    substrate: FR4, process,
    nodes: [port('p1', 0, 0, Math.PI), open('o1', length, 0), port('p2', 0, y2, Math.PI), open('o2', length, y2)],
    segments: [line('lower', 'p1', 'o1', wd(w1), lenOf(length)), line('upper', 'p2', 'o2', wd(w2), lenOf(length))],
  });
}

