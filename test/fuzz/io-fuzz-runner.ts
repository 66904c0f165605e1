/**
 * Child process of the I/O fuzz suites (see io-watchdog.ts): `io-fuzz-runner.ts SUITE SEED START COUNT` builds the
 * suite's COUNT inputs from SEED (fast-check, so the same every run), runs those from START on and prints one line
 * per input: `R <index> <accepted|refused|crash|non-finite|wording> <detail>`.
 */
import fc from 'fast-check';
import { mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { InputError } from '../../core/util/errors.ts';
import { readTouchstone, sparamsAdmittance, summarize, groupDelay, writeTouchstone, solveNetwork, idealLine } from '../../core/network/index.ts';

const ROOT = join(import.meta.dirname, '..', '..');
/** Wording that is not ours: the validation library's, the JavaScript engine's, or an object printed as such. */
export const FOREIGN_WORDING = /Invalid (key|type|length|value|format)|Expected .* but received|ValiError|\[object Object\]|\b(TypeError|RangeError|SyntaxError|ReferenceError)\b|Cannot read propert|is not a function|is not iterable|undefined is not|Maximum call stack|\bE(NOENT|ISDIR|NOTDIR|ACCES|PERM|EXIST|NXIO|AGAIN)\b/;

/** True when a message is not in our words. Quoted parts are the user's own text (a file may hold "NaN"). */
export function foreignWording(message: string): boolean {
  const unquoted = message.replace(/"(?:[^"\\]|\\.)*"|'[^'\n]*'/g, '"…"');
  return FOREIGN_WORDING.test(unquoted);
}

type Status = 'accepted' | 'refused' | 'crash' | 'non-finite' | 'wording';
type Outcome = { status: Status; detail?: string };
const report = (i: number, o: Outcome) => process.stdout.write(`R\t${i}\t${o.status}\t${(o.detail ?? '').replace(/[\t\n]/g, ' ').slice(0, 300)}\n`);

/** The first NaN or ±Infinity inside a value (typed arrays included), or null. */
export function nonFiniteIn(v: unknown, path = '$', depth = 0): string | null {
  if (typeof v === 'number') return Number.isFinite(v) ? null : path;
  if (v === null || typeof v !== 'object' || depth > 12) return null;
  if (ArrayBuffer.isView(v)) {
    const a = v as unknown as ArrayLike<number>;
    if (typeof a.length === 'number') for (let i = 0; i < a.length; i++) if (typeof a[i] === 'number' && !Number.isFinite(a[i])) return `${path}[${i}]`;
    return null;
  }
  for (const [k, x] of Object.entries(v)) { const p = nonFiniteIn(x, `${path}.${k}`, depth + 1); if (p) return p; }
  return null;
}

// ---------------------------------------------------------------------------------------------------------------
// Touchstone: generated files (structure-aware) and damaged real files.

const REAL = (() => {
  const dir = join(ROOT, 'test', 'fixtures', 'touchstone', 'skrf');
  const files = readdirSync(dir).filter((f) => /\.s\dp$/.test(f) && readFileSync(join(dir, f)).length < 40_000).map((f) => ({ name: f, text: readFileSync(join(dir, f), 'utf8') }));
  const own = writeTouchstone(solveNetwork({ elements: [{ kind: 'line', id: 't', a: 'a', b: 'b', length: 0.05, model: idealLine(60, 2) }, { kind: 'capacitor', id: 'c', a: 'b', b: 'gnd', value: 1e-12 }], ports: [{ name: '1', node: 'a', zRef: 50 }, { name: '2', node: 'b', zRef: 50 }] }, [1e9, 1.5e9, 2e9, 2.5e9]), { format: 'db' });
  return [...files, { name: 'own.s2p', text: own }];
})();

const extremeNumber = fc.oneof(
  fc.constantFrom('0', '-0', '1', '-1', '1e308', '-1e308', '1e309', '1e-320', '7000', '-7000', '6165', '1e300', 'NaN', 'Infinity', '+.5', '.', '-', '1e', '0x10', '1_000', '१', '٣'),
  fc.double({ noNaN: false }).map(String),
  fc.integer({ min: -1000, max: 1000 }).map(String),
);
const optionLine = fc.tuple(
  fc.constantFrom('', 'hz', 'khz', 'MHz', 'GHz', 'THz', 'xHz'), fc.constantFrom('', 'S', 'Y', 'Z', 'H', 'G', 'Q'),
  fc.constantFrom('', 'RI', 'MA', 'DB', 'dB', 'XX'), fc.oneof(fc.constant(''), extremeNumber.map((r) => `R ${r}`), fc.constantFrom('R', 'R (50+50j)')),
).map((p) => `# ${p.filter(Boolean).join(' ')}`);
const freqPlan = fc.constantFrom('rising', 'repeat', 'falling', 'negative', 'huge', 'random');
const generated = fc.record({
  ports: fc.integer({ min: 1, max: 4 }), name: fc.constantFrom('.s1p', '.s2p', '.s3p', '.s4p', '.ts', '', '.s0p', '.s99999p'),
  option: optionLine, records: fc.integer({ min: 0, max: 6 }), plan: freqPlan,
  values: fc.array(fc.oneof({ weight: 6, arbitrary: fc.double({ min: -2, max: 2, noNaN: true }).map((x) => x.toPrecision(6)) }, { weight: 1, arbitrary: extremeNumber }), { minLength: 1, maxLength: 40 }),
  crlf: fc.boolean(), v2: fc.boolean(), comment: fc.string({ maxLength: 12 }), dropLast: fc.nat(3),
}).map((g) => {
  const per = 2 * g.ports * g.ports;
  const lines: string[] = [];
  if (g.v2) lines.push('[Version] 2.0');
  lines.push(`! ${g.comment}`, g.option);
  if (g.v2) lines.push(`[Number of Ports] ${g.ports}`, ...(g.ports === 2 ? ['[Two-Port Data Order] 12_21'] : []), `[Number of Frequencies] ${g.records}`, '[Network Data]');
  let k = 0;
  for (let r = 0; r < g.records; r++) {
    const f = g.plan === 'rising' ? r + 1 : g.plan === 'repeat' ? Math.min(r + 1, 2) : g.plan === 'falling' ? 10 - r : g.plan === 'negative' ? r - 2 : g.plan === 'huge' ? `${r + 1}e300` : g.values[r % g.values.length];
    const vals: string[] = [];
    for (let t = 0; t < per; t++) vals.push(String(g.values[k++ % g.values.length]));
    lines.push([String(f), ...vals].join(' '));
  }
  if (g.dropLast > 0 && lines.length > 2) lines[lines.length - 1] = lines[lines.length - 1]!.split(' ').slice(0, -g.dropLast).join(' ');
  if (g.v2) lines.push('[End]');
  return { name: `gen${g.name}`, text: lines.join(g.crlf ? '\r\n' : '\n') + '\n' };
});
const damaged = fc.record({
  file: fc.nat(REAL.length - 1), kind: fc.constantFrom('truncate', 'insert', 'delete', 'duplicate', 'swap', 'number', 'bytes'),
  at: fc.nat(), len: fc.nat(200), insert: fc.oneof(fc.string({ maxLength: 20 }), extremeNumber, fc.constantFrom('\n', '\r', '!', '#', '[', ']', '\u0000', '\uFEFF', '\u00e9')),
}).map((d) => {
  const { name, text } = REAL[d.file]!;
  const at = d.at % (text.length + 1);
  const lines = text.split('\n');
  const li = d.at % lines.length;
  let out = text;
  switch (d.kind) {
    case 'truncate': out = text.slice(0, at); break;
    case 'insert': out = text.slice(0, at) + d.insert + text.slice(at); break;
    case 'delete': out = text.slice(0, at) + text.slice(at + d.len); break;
    case 'duplicate': lines.splice(li, 0, lines[li]!); out = lines.join('\n'); break;
    case 'swap': { const lj = (li + 1 + d.len) % lines.length; [lines[li], lines[lj]] = [lines[lj]!, lines[li]!]; out = lines.join('\n'); break; }
    case 'number': out = text.replace(/-?\d+\.?\d*(e[+-]?\d+)?/gi, (m, _e, off: number) => (off >= at && off < at + 80 ? d.insert : m)); break;
    case 'bytes': out = text.slice(0, at) + String.fromCharCode(0xd800 + (d.len % 0x400)) + text.slice(at); break;
  }
  return { name, text: out };
});

function touchstoneInputs(seed: number, count: number) {
  return fc.sample(fc.oneof({ weight: 3, arbitrary: generated }, { weight: 2, arbitrary: damaged }), { seed, numRuns: count });
}

function touchstoneOne(inp: { name: string; text: string }): Outcome {
  try {
    const d = readTouchstone(inp.text, { fileName: inp.name });
    const bad = nonFiniteIn(d.freqs) ?? nonFiniteIn(d.s) ?? nonFiniteIn(d.ports);
    if (bad) return { status: 'non-finite', detail: `read gave ${bad}` };
    for (let k = 1; k < d.freqs.length; k++) if (d.freqs[k]! < d.freqs[k - 1]!) return { status: 'non-finite', detail: `falling frequency kept at ${k}` };
    const figs = nonFiniteIn(summarize(d, 0)) ?? (d.ports.length > 1 ? nonFiniteIn(groupDelay(d, 1, 0)) : null);
    if (figs) return { status: 'non-finite', detail: `figures ${figs}` };
    for (const w of d.warnings) if (foreignWording(w.message)) return { status: 'wording', detail: w.message };
    if (d.ports.length <= 2) {
      try {
        const part = sparamsAdmittance(inp.text, inp.name, inp.name);
        const y = part.y(d.freqs[0]!);
        const b = nonFiniteIn(y);
        if (b) return { status: 'non-finite', detail: `part admittance ${b}` };
      } catch (e) {
        if (!(e instanceof InputError)) return { status: 'crash', detail: `part: ${String((e as Error)?.stack ?? e)}` };
        if (foreignWording(e.message)) return { status: 'wording', detail: e.message };
      }
    }
    return { status: 'accepted' };
  } catch (e) {
    if (!(e instanceof InputError)) return { status: 'crash', detail: String((e as Error)?.stack ?? e) };
    // Our messages quote what the file holds ("NaN" may be the user's text); outside quotes it would be ours.
    if (foreignWording(e.message) || /\bNaN\b|\bundefined\b/.test(e.message.replace(/"(?:[^"\\]|\\.)*"/g, '"…"'))) return { status: 'wording', detail: e.message };
    return { status: 'refused' };
  }
}

// ---------------------------------------------------------------------------------------------------------------
// Bridge: every channel's argument checks and sender check, through registerBridge with a real Shell in a temp folder.

async function bridgeSuite(seed: number, start: number, count: number): Promise<void> {
  const { CHANNELS, ipcName } = await import('../../bridge/contract.ts');
  const { RecoveryStore } = await import('../../electron/files/recovery-store.ts');
  const { registerBridge } = await import('../../electron/ipc.ts');
  const { Shell } = await import('../../electron/shell.ts');
  type H = (event: unknown, ...args: unknown[]) => Promise<unknown>;
  const dir = mkdtempSync(join(tmpdir(), 'sw-fuzz-bridge-'));
  const none = async () => null;
  const shell = new Shell({ userData: dir, documentsFolder: dir, recovery: new RecoveryStore(join(dir, 'recovery'), 'fuzz'), version: '0.1.0', dialogs: { openDesign: none, openTouchstone: none, saveDesign: none, saveExport: none, chooseFolder: none, confirmReplace: async () => false } });
  await shell.start();
  const handlers = new Map<string, H>();
  registerBridge({ handle: (name: string, h: H) => { handlers.set(name, h); } } as never, shell, { setDocumentState: () => {} });
  const good: Record<string, unknown> = {
    'design:open-path': { path: join(dir, 'a.stripwright') }, 'design:save': { docId: 'd1', path: join(dir, 'a.stripwright'), text: '{}', expectedModifiedMs: null },
    'design:save-as': { docId: 'd1', suggestedName: 'a', text: '{}' }, 'export:files': { title: 'Export', files: [{ name: 'a.gbr', data: 'x' }] },
    'autosave:write': { docId: 'd1', name: 'n', path: null, text: '{}' }, 'autosave:discard': { docId: 'd1' }, 'recovery:read': { docId: 'd1' },
    'recovery:discard': { docId: 'd1' }, 'document:state': { title: 't', dirty: true },
  };
  const hostile = fc.oneof(
    fc.anything({ maxDepth: 3, withTypedArray: true, withBigInt: true, withMap: true, withSet: true, withDate: true, withNullPrototype: true, withSparseArray: true, withBoxedValues: true }),
    fc.constantFrom(NaN, Infinity, -Infinity, -0, '', '\u0000', 'x'.repeat(5000), '../../etc/passwd', 'CON', '.hidden', 'a/b', 'a\\b', 'a'.repeat(65), '__proto__', 'constructor'),
    fc.constant(Object.assign(Object.create(null), { toString: 1 })), fc.constant(JSON.parse('{"__proto__": {"polluted": true}}')),
  );
  const mutate = (base: unknown) => fc.record({ key: fc.constantFrom('docId', 'path', 'text', 'expectedModifiedMs', 'suggestedName', 'title', 'files', 'name', 'dirty', 'extra', '__proto__'), value: hostile, drop: fc.boolean() })
    .map(({ key, value, drop }) => {
      const o: Record<string, unknown> = { ...(base as Record<string, unknown>) };
      if (drop) delete o[key]; else Object.defineProperty(o, key, { value, enumerable: true, configurable: true, writable: true });
      return o;
    });
  const filesArg = fc.array(fc.record({ name: fc.oneof(fc.string({ maxLength: 20 }), hostile), data: fc.oneof(fc.string({ maxLength: 10 }), fc.uint8Array({ maxLength: 8 }), hostile) }, { requiredKeys: [] }), { maxLength: 4 })
    .map((files) => ({ title: 'Export', files }));
  const sender = fc.oneof({ weight: 8, arbitrary: fc.constant({ senderFrame: { url: 'app://stripwright/index.html', parent: null } }) },
    { weight: 1, arbitrary: fc.constantFrom({}, { senderFrame: null }, { senderFrame: { url: 'https://evil.example/' } }, { senderFrame: { url: 'app://stripwright/index.html', parent: {} } }, { senderFrame: { url: 'app://stripwright:1/index.html' } }) });
  const call = fc.record({
    channel: fc.constantFrom(...CHANNELS), event: sender, shape: fc.constantFrom('none', 'one', 'two', 'mutated', 'files'),
    arg: hostile, second: hostile,
  }).chain((c) => (c.shape === 'mutated' && good[c.channel] !== undefined ? mutate(good[c.channel]).map((arg) => ({ ...c, arg })) : c.shape === 'files' ? filesArg.map((arg) => ({ ...c, channel: 'export:files' as const, arg })) : fc.constant(c)));
  const inputs = fc.sample(call, { seed, numRuns: count });
  const CODES = new Set(['bad-request', 'forbidden', 'not-found', 'too-large', 'not-text', 'changed-on-disk', 'io']);
  process.stdout.write('READY\n');
  for (let i = start; i < count; i++) {
    const c = inputs[i]!;
    const args = c.shape === 'none' ? [] : c.shape === 'two' ? [c.arg, c.second] : [c.arg];
    let o: Outcome;
    try {
      const r = (await handlers.get(ipcName(c.channel))!(c.event, ...args)) as { ok?: unknown; value?: unknown; error?: { code?: unknown; message?: unknown } };
      if (typeof r !== 'object' || r === null || typeof r.ok !== 'boolean') o = { status: 'crash', detail: `not a result object: ${String(r)}` };
      else if (r.ok) {
        const b = nonFiniteIn(r.value);
        o = b ? { status: 'non-finite', detail: `${c.channel} ${b}` } : { status: 'accepted' };
      } else {
        const m = r.error?.message;
        if (typeof m !== 'string' || !CODES.has(String(r.error?.code))) o = { status: 'crash', detail: `malformed error ${JSON.stringify(r.error)}` };
        else if (/failed unexpectedly/.test(m)) o = { status: 'crash', detail: m };
        else if (foreignWording(m)) o = { status: 'wording', detail: m };
        else o = { status: 'refused' };
      }
    } catch (e) {
      o = { status: 'crash', detail: `threw: ${String((e as Error)?.stack ?? e)}` };
    }
    report(i, o);
  }
  rmSync(dir, { recursive: true, force: true });
}

// ---------------------------------------------------------------------------------------------------------------
// CLI: a sample of commands in-process (runCli, as bin/stripwright runs it) on generated arguments and files.

async function cliSuite(seed: number, start: number, count: number): Promise<void> {
  const { runCli } = await import('../../cli/main.ts');
  const examples = join(ROOT, 'assets', 'examples');
  const design = readFileSync(join(examples, 'wilkinson-2g45.json'), 'utf8');
  const stub = readFileSync(join(examples, 'open-stub-match.json'), 'utf8');
  const ts = touchstoneInputs(seed + 1, Math.max(1, count));
  const flagValue = fc.oneof(fc.constantFrom('', '0', '-1', '1e309', 'NaN', 'Infinity', '2.45GHz', '5 GHz', '1e400Hz', '50', '-50ohm', 'abc', '999999999', '3', '2mm', '0.1mil', 'μm', '--json', '-h'), fc.string({ maxLength: 8 }));
  const lineArgs = fc.array(fc.tuple(fc.constantFrom('--er', '--h', '--t', '--tand', '--sigma', '--z0', '--width', '--f', '--deg', '--length', '--preset', '--dispersion', '--conductor-loss', '--roughness', '--bogus'), flagValue), { maxLength: 5 })
    .map((pairs) => ['line', '--er', '4.4', '--h', '1.6mm', ...pairs.flat(), '--json']);
  const csv = fc.array(fc.array(fc.oneof(flagValue, fc.constantFrom('"', '""', ',', '\n')), { maxLength: 4 }), { maxLength: 5 })
    .map((rows) => ['z0,f,deg', ...rows.map((r) => r.join(','))].join('\n'));
  const damagedDesign = fc.record({ base: fc.constantFrom(design, stub), kind: fc.constantFrom('truncate', 'bytes', 'nul', 'bom16', 'latin1', 'empty', 'huge-line'), at: fc.nat() }).map(({ base, kind, at }) => {
    const cut = at % (base.length + 1);
    switch (kind) {
      case 'truncate': return Buffer.from(base.slice(0, cut));
      case 'bytes': return Buffer.concat([Buffer.from(base.slice(0, cut)), Buffer.from([0xc3, 0x28, 0xff]), Buffer.from(base.slice(cut))]);
      case 'nul': return Buffer.from(base.slice(0, cut) + '\u0000' + base.slice(cut));
      case 'bom16': return Buffer.from('\ufeff' + base, 'utf16le');
      case 'latin1': return Buffer.from(base.replace('"name"', '"name\u00e9"'), 'latin1');
      case 'empty': return Buffer.alloc(0);
      // Padding where JSON allows it (the design's content unchanged): the schema's own wording is the loader fuzz's
      // business (test/fuzz of the design loader), this sample is about bytes and sizes.
      default: return Buffer.from(base.replace('{', '{' + ' '.repeat(100_000 + cut)));
    }
  });
  const sweepFlags = fc.array(fc.tuple(fc.constantFrom('--from', '--to', '--points', '--input', '--format', '--unit', '--zref', '--touchstone', '--advisory'), flagValue), { maxLength: 3 })
    .map((pairs) => pairs.flat().map((v, i, a) => (a[i - 1] === '--points' && /^\d{4,}$/.test(v) ? '99999999' : v)));
  const anyArgv = fc.array(fc.oneof(fc.constantFrom('build', 'sweep', 'export', 'line', 'help', '--json', '--out', '--force', '--format', 'gerber', 'x.json', '-', '--', '-h', '--version'), fc.string({ maxLength: 10 })), { maxLength: 6 });
  const plan = fc.oneof(
    { weight: 3, arbitrary: fc.tuple(fc.nat(ts.length - 1), fc.boolean(), sweepFlags).map(([k, json, flags]) => ({ argv: ['sweep', ts[k]!.name.includes('.') ? ts[k]!.name : `${ts[k]!.name}.s2p`, ...(json ? ['--json'] : []), ...flags.filter((f) => !/^--(points|format|unit|zref|touchstone|advisory)$/.test(f))], files: { [ts[k]!.name.includes('.') ? ts[k]!.name : `${ts[k]!.name}.s2p`]: ts[k]!.text } })) },
    { weight: 2, arbitrary: lineArgs.map((argv) => ({ argv, files: {} })) },
    { weight: 1, arbitrary: csv.map((c) => ({ argv: ['line', '--er', '4.4', '--h', '1.6mm', '--f', '2GHz', '--batch', 'cases.csv'], files: { 'cases.csv': c } })) },
    { weight: 2, arbitrary: fc.tuple(damagedDesign, fc.constantFrom('build', 'sweep', 'export')).map(([bytes, cmd]) => ({ argv: cmd === 'export' ? [cmd, 'd.json', '--format', 'svg', '--out', 'o.svg'] : [cmd, 'd.json', '--json'], files: { 'd.json': bytes } })) },
    { weight: 1, arbitrary: sweepFlags.map((flags) => ({ argv: ['sweep', 'd.json', '--json', '--points', '7', ...flags.filter((f) => f !== '--points')], files: { 'd.json': design } })) },
    { weight: 2, arbitrary: anyArgv.map((argv) => ({ argv, files: {} })) },
  );
  const inputs = fc.sample(plan, { seed, numRuns: count });
  const base = mkdtempSync(join(tmpdir(), 'sw-fuzz-cli-'));
  process.stdout.write('READY\n');
  for (let i = start; i < count; i++) {
    const inp = inputs[i]!;
    const cwd = join(base, String(i));
    mkdirSync(cwd, { recursive: true });
    for (const [n, c] of Object.entries(inp.files)) writeFileSync(join(cwd, n), c as string | Buffer);
    const out: string[] = [], err: string[] = [];
    let o: Outcome;
    try {
      const code = await runCli(inp.argv as string[], { out: (t) => out.push(t), err: (t) => err.push(t), cwd });
      const stdout = out.join('\n'), stderr = err.join('\n');
      const json = inp.argv.includes('--json') && code === 0 && stdout.trim().startsWith('{');
      const computed = inp.argv.includes('--batch') ? resultColumns(stdout) : stdout;
      if (![0, 1, 2].includes(code)) o = { status: 'crash', detail: `exit ${code}` };
      else if (json && /\bnull\b|NaN|Infinity/.test(stdout)) o = { status: 'non-finite', detail: `${inp.argv.join(' ')}: ${stdout.match(/.{0,60}(null|NaN|Infinity).{0,20}/)?.[0]}` };
      else if (!json && /\bNaN\b|\bInfinity\b|\bundefined\b/.test(computed)) o = { status: 'non-finite', detail: `${inp.argv.join(' ')}: ${computed.match(/.{0,60}(NaN|Infinity|undefined).{0,20}/)?.[0]}` };
      else if (foreignWording(stderr) || foreignWording(stdout.slice(0, 2000))) o = { status: 'wording', detail: `${inp.argv.join(' ')}: ${(foreignWording(stderr) ? stderr : stdout).slice(0, 300)}` };
      else o = { status: code === 0 ? 'accepted' : 'refused' };
    } catch (e) {
      o = { status: 'crash', detail: `${inp.argv.join(' ')}: ${String((e as Error)?.stack ?? e)}` };
    }
    rmSync(cwd, { recursive: true, force: true });
    report(i, o);
  }
  rmSync(base, { recursive: true, force: true });
}

/** The computed columns of a `line --batch` CSV (the echoed input cells are the user's own text). */
function resultColumns(csv: string): string {
  const rows = parseCsv(csv);
  const header = rows[0] ?? [];
  const from = header.indexOf('width_m'), to = header.indexOf('error');
  if (from < 0) return '';
  return rows.slice(1).map((r) => r.slice(from, to < 0 ? undefined : to).join(',')).join('\n');
}

/** RFC 4180 CSV (quoted cells may hold commas, quotes and line breaks). */
function parseCsv(text: string): string[][] {
  const rows: string[][] = [];
  let row: string[] = [], cell = '', quoted = false;
  for (let i = 0; i < text.length; i++) {
    const c = text[i]!;
    if (quoted) {
      if (c === '"') { if (text[i + 1] === '"') { cell += '"'; i++; } else quoted = false; } else cell += c;
    } else if (c === '"') quoted = true;
    else if (c === ',') { row.push(cell); cell = ''; }
    else if (c === '\n') { row.push(cell); rows.push(row); row = []; cell = ''; }
    else cell += c;
  }
  row.push(cell); rows.push(row);
  return rows;
}

// ---------------------------------------------------------------------------------------------------------------

const [suite, seedText, startText, countText] = process.argv.slice(2);
const seed = Number(seedText), start = Number(startText), count = Number(countText);
if (suite === 'touchstone') {
  const inputs = touchstoneInputs(seed, count);
  process.stdout.write('READY\n');
  for (let i = start; i < count; i++) report(i, touchstoneOne(inputs[i]!));
} else if (suite === 'bridge') {
  await bridgeSuite(seed, start, count);
} else if (suite === 'cli') {
  await cliSuite(seed, start, count);
} else if (suite === 'watchdog-self-test') {
  // Input 1 never ends and input 2 kills its process: the watchdog must count a hang and a crash and go on.
  process.stdout.write('READY\n');
  for (let i = start; i < count; i++) {
    if (i === 1) for (;;) { /* a runaway loop */ }
    if (i === 2) process.exit(3);
    report(i, { status: 'accepted' });
  }
} else {
  process.stderr.write(`unknown suite ${suite}\n`);
  process.exit(2);
}
