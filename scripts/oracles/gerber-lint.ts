/**
 * Our own rule checker for Gerber RS-274X/X2 and Excellon drill files, written from the open specifications
 * (Ucamco, "The Gerber Layer Format Specification", rev. 2022.02:
 * syntax, FS, MO, AD, G01–G03 and G75, LP, regions, attributes, deprecated commands; for drill files the Excellon header/body
 * layout of the Excellon format). It shares no code with core/export, so a passing file means
 * a second reading of the rules agrees with the writer.
 *
 * Library use: `lintGerber(text)` / `lintExcellon(text)` return a list of problems (empty = clean).
 * Command line: `npx tsx scripts/oracles/gerber-lint.ts FILE...` prints problems and exits 1 if any.
 */

export interface GerberFacts {
  units?: string;
  format?: { int: number; dec: number };
  fileFunction?: string;
  regions: number;
  contours: number;
  polarityChanges: number;
}

export function lintGerber(text: string): { problems: string[]; facts: GerberFacts } {
  const problems: string[] = [];
  const facts: GerberFacts = { regions: 0, contours: 0, polarityChanges: 0 };
  const p = (msg: string) => problems.push(msg);
  const blocks = splitGerber(text, p);
  let fsCount = 0, moCount = 0, m02 = -1, inRegion = false, g75 = false, arcMode = false;
  let current: { x: number; y: number } = { x: 0, y: 0 };
  let contourStart: { x: number; y: number } | null = null, contourSegs = 0;
  let aperture: number | null = null, sawCoordinate = false;
  const defined = new Set<number>();
  const tf = new Set<string>();
  const closeContour = (where: string) => {
    if (contourStart) {
      if (contourSegs < 3) p(`${where}: region contour with fewer than 3 segments`);
      if (current.x !== contourStart.x || current.y !== contourStart.y) p(`${where}: region contour not closed (ends at ${current.x},${current.y}, started at ${contourStart.x},${contourStart.y})`);
      facts.contours++;
    }
    contourStart = null; contourSegs = 0;
  };
  blocks.forEach((b, idx) => {
    const where = `block ${idx + 1} '${b.text.slice(0, 40)}'`;
    if (m02 >= 0) p(`${where}: content after M02`);
    if (b.extended) {
      const t = b.text;
      if (/^FS/.test(t)) {
        fsCount++;
        const m = /^FSLAX(\d)(\d)Y(\d)(\d)$/.exec(t);
        if (!m) p(`${where}: FS must be FSLAXnmYnm (leading zeros omitted, absolute)`);
        else {
          if (m[1] !== m[3] || m[2] !== m[4]) p(`${where}: X and Y formats differ`);
          facts.format = { int: Number(m[1]), dec: Number(m[2]) };
          if (facts.format.dec < 5 || facts.format.dec > 6) p(`${where}: use 5 or 6 decimals in mm`);
        }
        if (sawCoordinate) p(`${where}: FS after the first coordinate`);
      } else if (/^MO/.test(t)) {
        moCount++;
        if (t !== 'MOMM' && t !== 'MOIN') p(`${where}: MO must be MOMM or MOIN`);
        facts.units = t.slice(2);
        if (sawCoordinate) p(`${where}: MO after the first coordinate`);
      } else if (/^AD/.test(t)) {
        const m = /^ADD(\d+)([A-Za-z_.$][\w.$]*),?(.*)$/.exec(t);
        if (!m) { p(`${where}: malformed aperture definition`); return; }
        const d = Number(m[1]);
        if (d < 10) p(`${where}: aperture numbers start at 10`);
        const params = m[3] === '' ? [] : m[3].split('X');
        if (!params.every((v) => /^\d*\.?\d+$/.test(v))) p(`${where}: aperture parameters must be decimal numbers separated by X`);
        if (m[2] === 'C' && (params.length < 1 || params.length > 2)) p(`${where}: circle aperture takes diameter [hole]`);
        if ((m[2] === 'R' || m[2] === 'O') && (params.length < 2 || params.length > 3)) p(`${where}: rectangle/obround aperture takes x, y [hole]`);
        defined.add(d);
      } else if (/^LP/.test(t)) {
        if (t !== 'LPD' && t !== 'LPC') p(`${where}: LP must be LPD or LPC`);
        if (inRegion) p(`${where}: LP inside a region`);
        facts.polarityChanges++;
      } else if (/^T[FAOD]/.test(t)) {
        if (/^TF/.test(t)) {
          const name = t.slice(2).split(',')[0];
          if (!/^[.A-Za-z_$][\w.$]*$/.test(name)) p(`${where}: bad attribute name`);
          tf.add(name);
          if (name === '.FileFunction') facts.fileFunction = t.slice(2 + name.length + 1);
        } else if (/^TD/.test(t)) {
          if (t.length > 2 && !/^TD[.A-Za-z_$][\w.$]*$/.test(t)) p(`${where}: bad TD`);
        } else if (!/^T[AO][.A-Za-z_$][\w.$]*(,.*)?$/.test(t)) p(`${where}: bad attribute`);
      } else if (/^(IP|IR|AS|MI|OF|SF|IN|LN)/.test(t)) {
        p(`${where}: deprecated image/layer command ${t.slice(0, 2)}`);
      } else if (/^(AM|SR|AB|LM|LR|LS)/.test(t)) {
        // allowed, not checked further
      } else p(`${where}: unknown extended command`);
      return;
    }
    const t = b.text;
    if (/^G0?4(\s|$)/.test(t) || t === 'G04') return; // comment
    if (t === 'M02') { m02 = idx; return; }
    if (/^(G54|G55|G70|G71|G90|G91|M00|M01|G74)/.test(t)) { p(`${where}: deprecated code ${t.slice(0, 3)}`); return; }
    if (t === 'G36') { if (inRegion) p(`${where}: G36 inside a region`); inRegion = true; facts.regions++; contourStart = null; return; }
    if (t === 'G37') { if (!inRegion) p(`${where}: G37 without G36`); closeContour(where); inRegion = false; return; }
    if (t === 'G75') { g75 = true; return; }
    let rest = t;
    const g = /^G0?([123])(?=\D|$)/.exec(rest);
    if (g) { arcMode = g[1] !== '1'; if (arcMode && !g75) p(`${where}: arc mode without G75 first`); rest = rest.slice(g[0].length); }
    if (rest === '') return;
    const sel = /^D(\d+)$/.exec(rest);
    if (sel && Number(sel[1]) >= 10) {
      const d = Number(sel[1]);
      if (!defined.has(d)) p(`${where}: aperture D${d} used but not defined`);
      if (inRegion) p(`${where}: aperture selected inside a region`);
      aperture = d; return;
    }
    const op = /^(?:X(-?\d+))?(?:Y(-?\d+))?(?:I(-?\d+))?(?:J(-?\d+))?D0?([123])$/.exec(rest);
    if (!op) { p(`${where}: unrecognised word command`); return; }
    sawCoordinate = true;
    if (fsCount === 0 || moCount === 0) p(`${where}: coordinate before FS and MO`);
    const maxDigits = facts.format ? facts.format.int + facts.format.dec : 10;
    for (const v of [op[1], op[2], op[3], op[4]]) if (v && v.replace('-', '').length > maxDigits) p(`${where}: coordinate has more digits than the FS allows`);
    const next = { x: op[1] !== undefined ? Number(op[1]) : current.x, y: op[2] !== undefined ? Number(op[2]) : current.y };
    const d = Number(op[5]);
    if (arcMode && d === 1 && op[3] === undefined && op[4] === undefined) p(`${where}: arc segment without I/J (modal G02/G03 left on?)`);
    if (d === 3 && inRegion) p(`${where}: D03 flash inside a region`);
    if (!inRegion && (d === 1 || d === 3) && aperture === null) p(`${where}: draw or flash with no aperture selected`);
    if (inRegion) {
      if (d === 2) { closeContour(where); contourStart = next; }
      else if (d === 1) { if (!contourStart) { contourStart = current; } contourSegs++; }
    }
    current = next;
  });
  if (fsCount !== 1) p(`FS must appear exactly once (found ${fsCount})`);
  if (moCount !== 1) p(`MO must appear exactly once (found ${moCount})`);
  if (inRegion) p('file ends inside a region (G36 without G37)');
  if (m02 < 0) p('file does not end with M02');
  for (const a of ['.FileFunction', '.FilePolarity', '.GenerationSoftware']) if (!tf.has(a)) p(`X2 file attribute ${a} missing`);
  return { problems, facts };
}

/** Splits a Gerber file into word commands ('…*') and extended commands ('%…*%'), checking the delimiters. */
function splitGerber(text: string, p: (m: string) => void): { text: string; extended: boolean }[] {
  const out: { text: string; extended: boolean }[] = [];
  let i = 0;
  const s = text.replace(/\r?\n/g, '');
  while (i < s.length) {
    if (s[i] === '%') {
      const end = s.indexOf('%', i + 1);
      if (end < 0) { p('unterminated extended command (missing closing %)'); break; }
      const inner = s.slice(i + 1, end);
      if (!inner.endsWith('*')) p(`extended command '${inner.slice(0, 30)}' does not end with *`);
      for (const part of inner.split('*')) if (part !== '') out.push({ text: part, extended: true });
      i = end + 1;
    } else {
      const end = s.indexOf('*', i);
      if (end < 0) { p(`trailing text without *: '${s.slice(i, i + 30)}'`); break; }
      out.push({ text: s.slice(i, end), extended: false });
      i = end + 1;
    }
  }
  return out;
}

export interface ExcellonFacts { units?: string; tools: Map<number, number>; hits: { tool: number; x: number; y: number }[]; fileFunction?: string }

export function lintExcellon(text: string): { problems: string[]; facts: ExcellonFacts } {
  const problems: string[] = [];
  const p = (m: string) => problems.push(m);
  const facts: ExcellonFacts = { tools: new Map(), hits: [] };
  const lines = text.split(/\r?\n/).map((l) => l.trim()).filter((l) => l !== '');
  if (lines[0] !== 'M48') p('first line must be M48 (header start)');
  let inHeader = true, tool: number | null = null, ended = false;
  lines.forEach((l, n) => {
    const where = `line ${n + 1} '${l}'`;
    if (ended) p(`${where}: content after M30`);
    if (l.startsWith(';')) {
      const m = /^; #@! TF\.FileFunction,(.*)$/.exec(l);
      if (m) facts.fileFunction = m[1];
      return;
    }
    if (inHeader) {
      if (l === 'M48') return;
      if (l === '%' || l === 'M95') { inHeader = false; return; }
      if (/^(METRIC|INCH)/.test(l)) { facts.units = l.split(',')[0]; return; }
      if (/^FMAT,2$/.test(l)) return;
      const t = /^T(\d+)C(\d*\.\d+)$/.exec(l);
      if (t) { if (facts.tools.has(Number(t[1]))) p(`${where}: tool defined twice`); facts.tools.set(Number(t[1]), Number(t[2])); return; }
      p(`${where}: unexpected header line`);
      return;
    }
    if (l === 'G90' || l === 'G05') return;
    if (l === 'M30') { ended = true; return; }
    const sel = /^T(\d+)$/.exec(l);
    if (sel) { tool = Number(sel[1]); if (!facts.tools.has(tool)) p(`${where}: tool T${tool} not in the tool table`); return; }
    const hit = /^X(-?\d+\.\d+)Y(-?\d+\.\d+)$/.exec(l);
    if (hit) { if (tool === null) p(`${where}: hit before a tool is selected`); facts.hits.push({ tool: tool ?? -1, x: Number(hit[1]), y: Number(hit[2]) }); return; }
    p(`${where}: not a hit with decimal coordinates, tool change, G90, G05 or M30`);
  });
  if (inHeader) p('header never ends (% or M95 missing)');
  if (facts.units !== 'METRIC') p('units must be METRIC');
  if (!ended) p('file does not end with M30');
  return { problems, facts };
}

// Command line use.
if (import.meta.url === `file://${process.argv[1]}`) {
  const { readFileSync } = await import('node:fs');
  let bad = 0;
  for (const f of process.argv.slice(2)) {
    const text = readFileSync(f, 'utf8');
    const { problems } = /^M48/.test(text.trimStart()) ? lintExcellon(text) : lintGerber(text);
    console.log(problems.length === 0 ? `${f}: OK` : `${f}:\n  ${problems.join('\n  ')}`);
    if (problems.length) bad++;
  }
  process.exit(bad ? 1 : 0);
}
