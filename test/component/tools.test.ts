/**
 * The drawing tools as a state machine, with a recording host (no DOM). Facts checked: heading snap to 45° and 90°
 * (plane geometry), a run commits once at its end (one undo step), Esc commits nothing, a press that does not move
 * is a click, not a drag (3 px threshold, common practice for pointer UIs), and the stale-result rule of the worker
 * client (a newer job of the same kind wins).
 */
import { describe, expect, it } from 'vitest';
import { ToolMachine, type ToolHost } from '../../renderer/src/board/tools.ts';
import type { BoardPointer } from '../../renderer/src/board/BoardController.ts';
import { ComputeClient } from '../../renderer/src/worker/client.ts';
import type { Vec2 } from '../../core/geometry/types.ts';

function recorder() {
  const calls: [string, ...unknown[]][] = [];
  const selected = new Set<string>();
  const host: ToolHost = {
    gridStep: () => 1e-3,
    nodeAt: (id) => (id === 'p1' ? { at: { x: 0, y: 0 }, kind: 'port', degree: 0 } : id === 'p2' ? { at: { x: 0, y: 0.01 }, kind: 'port', degree: 1 } : id === 'v1' ? { at: { x: 0.01, y: 0 }, kind: 'vertex', degree: 2 } : null),
    formatLength: (m) => `${(m * 1e3).toFixed(2)} mm`,
    segmentEnds: (id) => (id === 's1' ? { a: { x: 0, y: 0 }, b: { x: 0.02, y: 0 } } : null),
    isSelected: (id) => selected.has(id),
    select: (ids, mode) => { if (mode === 'replace') selected.clear(); ids.forEach((i) => selected.add(i)); calls.push(['select', ids, mode]); },
    hover: () => {},
    beginMove: () => calls.push(['beginMove']),
    moveBy: (d) => calls.push(['moveBy', d]),
    endMove: (c) => calls.push(['endMove', c]),
    boxSelect: (b, a) => calls.push(['boxSelect', b, a]),
    addRun: (from, pts, end) => calls.push(['addRun', from, pts, end]),
    addTee: (seg, at, pts, end) => calls.push(['addTee', seg, at, pts, end]),
    addStub: (seg, at, side, end) => calls.push(['addStub', seg, at, side, end]),
    insert: (seg, at, kind) => calls.push(['insert', seg, at, kind]),
    addPort: (at) => calls.push(['addPort', at]),
    setOutline: (pts) => calls.push(['setOutline', pts]),
    addArea: (k, pts) => calls.push(['addArea', k, pts]),
    preview: (p) => { if (p.measure) calls.push(['measure', p.measure.text]); },
    status: () => {},
  };
  return { host, calls, selected };
}

const ev = (type: BoardPointer['type'], at: Vec2, o: Partial<BoardPointer> = {}): BoardPointer => ({
  type, at, screen: { x: at.x * 1e4, y: -at.y * 1e4 }, button: 0, shiftKey: false, altKey: false, ctrlKey: false, hit: null, tolerance: 1e-4, clicks: 1, ...o,
});

describe('drawing tools', () => {
  it('routes from a port with 45° snap and commits the whole run once', () => {
    const { host, calls } = recorder();
    const t = new ToolMachine(host);
    t.setTool('route');
    t.handle(ev('down', { x: 0, y: 0 }, { hit: { kind: 'node', id: 'p1' } }));
    t.handle(ev('down', { x: 0.0101, y: 0.0004 })); // a little off the axis: snaps to 0°, 10 mm
    t.handle(ev('down', { x: 0.0101 + 0.0052, y: 0.0048 })); // about 43°: snaps to 45°
    expect(calls.filter((c) => c[0] === 'addRun')).toHaveLength(0);
    t.finish();
    const runs = calls.filter((c) => c[0] === 'addRun');
    expect(runs).toHaveLength(1);
    const [, from, pts] = runs[0] as [string, string, Vec2[]];
    expect(from).toBe('p1');
    expect(pts[0]).toEqual({ x: 0.01, y: 0 });
    expect(pts[1]!.x - pts[0]!.x).toBeCloseTo(pts[1]!.y - pts[0]!.y, 12);
  });

  it('Shift limits the heading to 90°, and Esc drops the run without committing', () => {
    const { host, calls } = recorder();
    const t = new ToolMachine(host);
    t.setTool('route');
    t.handle(ev('down', { x: 0, y: 0 }, { hit: { kind: 'node', id: 'p1' } }));
    t.handle(ev('down', { x: 0.006, y: 0.005 }, { shiftKey: true }));
    t.cancel();
    t.finish();
    expect(calls.filter((c) => c[0] === 'addRun')).toHaveLength(0);
    t.handle(ev('down', { x: 0, y: 0 }, { hit: { kind: 'node', id: 'p1' } }));
    t.handle(ev('down', { x: 0.006, y: 0.005 }, { shiftKey: true }));
    t.finish();
    const [, , pts] = calls.find((c) => c[0] === 'addRun') as [string, string, Vec2[]];
    expect(pts[0]!.y).toBe(0);
  });

  it('a run cannot start in empty space or at a port that has its line; it may start at a corner', () => {
    const { host, calls } = recorder();
    const t = new ToolMachine(host);
    t.setTool('route');
    t.handle(ev('down', { x: 0.005, y: 0.005 }));
    t.handle(ev('down', { x: 0, y: 0.01 }, { hit: { kind: 'node', id: 'p2' } }));
    expect(t.busy).toBe(false);
    t.handle(ev('down', { x: 0.01, y: 0 }, { hit: { kind: 'node', id: 'v1' } }));
    expect(t.busy).toBe(true);
    t.handle(ev('down', { x: 0.01, y: 0.01 }));
    t.finish();
    expect(calls.filter((c) => c[0] === 'addRun').map((c) => c[1])).toEqual(['v1']);
  });

  it('shows the live length and angle of the piece being drawn, and a run ending on a line ends there with a tee', () => {
    const { host, calls } = recorder();
    const t = new ToolMachine(host);
    t.setTool('route');
    t.handle(ev('down', { x: 0, y: 0.01 }, { hit: { kind: 'node', id: 'p1' } }));
    t.handle(ev('move', { x: 0, y: 0.015 }));
    // 15 mm straight up from the port at the origin: 90° (0° = +x, counter-clockwise; plane geometry).
    expect(calls.filter((c) => c[0] === 'measure').at(-1)).toEqual(['measure', '15.00 mm · 90.0°']);
    t.handle(ev('down', { x: 0.012, y: 0.0003 }, { hit: { kind: 'segment', id: 's1' } }));
    const run = calls.find((c) => c[0] === 'addRun')!;
    expect(run[2]).toEqual([{ x: 0.012, y: 0 }]);
    expect(run[3]).toEqual({ segment: 's1' });
    expect(t.busy).toBe(false);
  });

  it('a click on a port that already has its line does not end the run there (the run is kept)', () => {
    const { host, calls } = recorder();
    const t = new ToolMachine(host);
    t.setTool('route');
    t.handle(ev('down', { x: 0, y: 0 }, { hit: { kind: 'node', id: 'p1' } }));
    t.handle(ev('down', { x: 0, y: 0.01 }, { hit: { kind: 'node', id: 'p2' } }));
    expect(t.busy).toBe(true);
    expect(calls.filter((c) => c[0] === 'addRun')).toHaveLength(0);
  });

  it('a press without movement selects; a drag moves the selection as one live step', () => {
    const { host, calls } = recorder();
    const t = new ToolMachine(host);
    t.handle(ev('down', { x: 0, y: 0 }, { hit: { kind: 'node', id: 'p1' } }));
    t.handle(ev('move', { x: 0.0001, y: 0 }, { screen: { x: 1, y: 0 } }));
    t.handle(ev('up', { x: 0.0001, y: 0 }));
    expect(calls.some((c) => c[0] === 'beginMove')).toBe(false);
    t.handle(ev('down', { x: 0, y: 0 }, { hit: { kind: 'node', id: 'p1' }, screen: { x: 0, y: 0 } }));
    for (let k = 1; k <= 5; k++) t.handle(ev('move', { x: k * 1e-3, y: 0 }, { screen: { x: k * 10, y: 0 } }));
    t.handle(ev('up', { x: 5e-3, y: 0 }));
    expect(calls.filter((c) => c[0] === 'beginMove')).toHaveLength(1);
    expect(calls.filter((c) => c[0] === 'endMove')).toEqual([['endMove', true]]);
    const moved = calls.filter((c) => c[0] === 'moveBy').reduce((s, c) => s + (c[1] as Vec2).x, 0);
    expect(moved).toBeCloseTo(5e-3, 12);
  });

  it('stubs go on the side of the cursor; a board edge needs three corners', () => {
    const { host, calls } = recorder();
    const t = new ToolMachine(host);
    t.setTool('stub-open');
    t.handle(ev('down', { x: 0.01, y: 0.0002 }, { hit: { kind: 'segment', id: 's1' } }));
    t.setTool('stub-short');
    t.handle(ev('down', { x: 0.01, y: -0.0002 }, { hit: { kind: 'segment', id: 's1' } }));
    const stubs = calls.filter((c) => c[0] === 'addStub');
    expect(stubs.map((c) => [c[3], c[4]])).toEqual([[1, 'open'], [-1, 'short']]);
    t.setTool('outline');
    t.handle(ev('down', { x: 0, y: 0 }));
    t.handle(ev('down', { x: 0.01, y: 0 }));
    t.finish();
    expect(calls.filter((c) => c[0] === 'setOutline')).toHaveLength(0);
  });
});

describe('worker client', () => {
  it('drops a result superseded by a newer job of the same kind', async () => {
    let release: (() => void) | null = null;
    const client = new ComputeClient(null, async (_k, input) => {
      if (input === 'slow') await new Promise<void>((r) => { release = r; });
      return input;
    });
    const first = client.run<string>('layout', 'slow');
    const second = client.run<string>('layout', 'fast');
    expect(await second).toMatchObject({ ok: true, value: 'fast' });
    release!();
    expect(await first).toEqual({ ok: false, superseded: true });
  });
});
