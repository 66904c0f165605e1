/**
 * G-code writer: one tool program → the text of one `.nc` file, in a small RS-274 subset every hobby controller
 * reads: G0, G1, G2/G3 (XY arcs with incremental I J), G17, G20 or G21, G90, M3/M5, M2, and an optional tool change
 * (T… M6). Pure and deterministic: the same plan gives the same bytes (no timestamp).
 *
 * Frame: X0 Y0 is the board's lower-left corner (the plan's origin), Z0 the top of the copper, Z up. Numbers are
 * written to 1 µm in mm (3 decimals) and to 0.1 thou in inches (4 decimals); feeds per minute. Comments are ASCII in
 * parentheses (some controllers refuse other bytes), one per line.
 */
import type { MillingPlan, ToolProgram } from '../toolpath/index.ts';

export interface GcodeInfo {
  application: string;
  version: string;
  designName: string;
  /** The design's hash (core/network designHash), so a file can be matched to the design it came from. */
  designHash: string;
}

/** The cautions written at the head of every file and shown with every G-code export. */
export const MILLING_CAUTIONS: readonly string[] = [
  'Milling glass-fibre laminate makes fine dust: run dust extraction or a vacuum at the cutter and wear a suitable dust mask.',
  'Wear eye protection, keep the spindle guards in place, and wear hearing protection for long jobs.',
  'Never leave the machine running unattended. Follow the machine\'s manual and your local rules.',
];

/** Comment text safe for every controller: ASCII letters, digits and simple punctuation, no parentheses. */
export function gcodeComment(text: string): string {
  const ascii = text.normalize('NFKD').replace(/[°]/g, ' deg').replace(/[×]/g, 'x').replace(/[–—]/g, '-').replace(/[()]/g, '').replace(/[^\x20-\x7e]/g, '');
  return `(${ascii.replace(/\s+/g, ' ').trim()})`;
}

function fixed(v: number, decimals: number): string {
  const s = v.toFixed(decimals).replace(/0+$/, '').replace(/\.$/, '');
  return s === '-0' ? '0' : s;
}

/** The text of one program. */
export function toGcode(plan: MillingPlan, program: ToolProgram, info: GcodeInfo): string {
  const o = plan.options;
  const inch = o.units === 'inch';
  const k = inch ? 1 / 25.4e-3 : 1e3; // metres → file units
  const dec = inch ? 4 : 3;
  const X = (m: number) => fixed((m - plan.origin.x) * k, dec);
  const Y = (m: number) => fixed((m - plan.origin.y) * k, dec);
  const Z = (m: number) => fixed(m * k, dec);
  const L = (m: number) => fixed(m * k, dec);
  const F = (mps: number) => fixed(mps * 60 * k, 1);
  const u = inch ? 'in' : 'mm';
  const t = program.tool;
  const lines: string[] = [];
  const c = (s: string) => lines.push(gcodeComment(s));
  c(`${info.application} ${info.version}: ${info.designName}, design hash ${info.designHash}`);
  c(`Tool ${t.number} of ${plan.programs.length}: ${t.label}`);
  c(`Work: ${program.operations.join(', ')}; run the files in tool order`);
  c(`Units: ${inch ? 'inches G20' : 'millimetres G21'}, absolute G90, feeds in ${u}/min`);
  c(`Origin: X0 Y0 = lower-left corner of the board, ${L(plan.size.width)} x ${L(plan.size.height)} ${u}; Z0 = top of the copper, Z up`);
  c(`Work area: ${L(o.workArea.width)} x ${L(o.workArea.height)} ${u} with the board corner at X ${L(o.boardAt.x)} Y ${L(o.boardAt.y)} ${u} in it`);
  c(`Safe height ${Z(o.safeHeight)} ${u}, travel height ${Z(o.travelHeight)} ${u}, spindle ${program.spindleRpm} rpm`);
  c(`Estimated time ${Math.ceil(program.seconds / 60)} min: ${L(program.cutLength)} ${u} cutting, ${L(program.travelLength)} ${u} travel`);
  for (const s of MILLING_CAUTIONS) c(`CAUTION: ${s}`);
  // What the isolation mills differently from what the design asks (fewer passes than its clearance needs, or a
  // channel other than the one the lines were sized beside) travels with the file that mills it.
  if (program.operations.includes('isolation')) {
    for (const f of plan.findings) if (f.code === 'isolation-passes' || f.code === 'isolation-gap') c(`NOTE: ${f.message}`);
  }
  lines.push(`G90 G17 ${inch ? 'G20' : 'G21'}`);
  lines.push(`G0 Z${Z(o.safeHeight)}`);
  if (o.toolChange) { c(`Change to tool ${t.number}: ${t.label}`); lines.push(`T${t.number} M6`); lines.push(`G0 Z${Z(o.safeHeight)}`); }
  lines.push(`G0 X${X(program.start.x)} Y${Y(program.start.y)}`);
  lines.push(`M3 S${program.spindleRpm}`);
  let feed = -1;
  let at = program.start;
  for (const m of program.moves) {
    const words: string[] = [];
    const moved = (a: number, b: number) => Math.abs(a - b) > 1e-12;
    if (m.kind === 'arc') {
      words.push(m.clockwise ? 'G2' : 'G3', `X${X(m.to.x)}`, `Y${Y(m.to.y)}`);
      if (moved(m.to.z, at.z)) words.push(`Z${Z(m.to.z)}`);
      words.push(`I${L(m.centre.x - at.x)}`, `J${L(m.centre.y - at.y)}`);
    } else {
      words.push(m.kind === 'rapid' ? 'G0' : 'G1');
      if (moved(m.to.x, at.x)) words.push(`X${X(m.to.x)}`);
      if (moved(m.to.y, at.y)) words.push(`Y${Y(m.to.y)}`);
      if (moved(m.to.z, at.z)) words.push(`Z${Z(m.to.z)}`);
      if (words.length === 1) { at = m.to; continue; }
    }
    if (m.kind !== 'rapid' && m.feed !== feed) { words.push(`F${F(m.feed)}`); feed = m.feed; }
    lines.push(words.join(' '));
    at = m.to;
  }
  lines.push(`G0 Z${Z(o.safeHeight)}`);
  lines.push('M5');
  lines.push('M2');
  return lines.join('\n') + '\n';
}
