/**
 * `stripwright edit DESIGN (--commands FILE.json | --command JSON)… --out NEW.json`: applies design commands given
 * as data — the drawing gestures (route, tee, stub, insert) and every other design command — through the core's
 * `applyCommandList` (core/design/command-list.ts: each command through `History.apply`, as the app's editor runs
 * one edit), and writes the new design atomically. Refused whole: if any command fails, nothing is written.
 */
import { parseArgs } from 'node:util';
import { resolve } from 'node:path';
import {
  InputError, applyCommandList, parseCommandList, parseDesign, serializeDesign,
  type ChangeSummary, type CommandEntry,
} from '../../core/index.ts';
import { UsageError, type CliCommand, type CliIo } from '../registry.ts';
import { COMMANDS_INPUT, DESIGN_TEXT, readInputText, writeOutputFile } from '../files.ts';

const USAGE = `Usage: stripwright edit DESIGN (--commands FILE.json | --command JSON)... --out NEW.json

Applies design commands to DESIGN in order and writes the result to NEW.json. A command is data, the same an edit in
the app makes: {"id": "run.route", "args": {...}}. --commands FILE holds one command or a list of them; each
--command gives one more, applied after the file's, in the order given. Positions are metres, angles radians, as in
the design file. The whole list is refused if one command fails: the message names the command (its place in the
list), the field, what was expected and what was found, and nothing is written.

Drawing commands (each one undo step in the app):
  run.route   {"from": NODE, "points": [{x, y}, ...], "onto"?: {"segment": ID} | {"node": ID}, "spec"?: SEGMENT}
              a run from a port without a line, an open or shorted end, or a corner, through the points; it ends
              open, on a line (split there by a tee) or on a node
  run.tee     {"segment": ID, "at": {x, y}, "points": [...], "onto"?: ...}
              a tee on a line at "at" and a run from it
  run.stub    {"segment": ID, "at": {x, y}, "end"?: "open" | "short", "side"?: 1 | -1, "deg"?: 90, "reach"?: M}
              a stub off a line, "deg" electrical degrees at f0 (default 90), drawn "reach" metres long
  run.insert  {"segment": ID, "at": {x, y}, "kind": "step" | "taper" | "part", ...}
              a width step ("side", "width"), a linear taper ("span", "width") or a chip part ("part", "value",
              "size") inserted into a line
Other commands: node.add, node.move, node.setSpec, segment.add, segment.setSpec, segment.split, run.extend,
selection.delete, selection.translate, selection.rotate, selection.mirror, design.setSubstrate,
design.setFrequency, design.setProcess, design.setTargets, ... (the error for an unknown id lists them all).

Options:
  --commands FILE   a JSON file: one command object or a list of them
  --command JSON    one command object (repeatable)
  --out FILE        where to write the edited design (may be DESIGN itself; written atomically)

Exit status: 0 written; 1 the design, the command list or a command was refused (nothing written); 2 a bad command
line.

Example:
  stripwright edit feed.json --command '{"id":"run.stub","args":{"segment":"s1","at":{"x":0.01,"y":0}}}' --out feed-stub.json`;

export const editCommand: CliCommand = {
  name: 'edit',
  summary: 'Apply design commands (route, tee, stub, insert, …) given as data, all or nothing',
  usage: USAGE,
  async run(argv: string[], io: CliIo): Promise<number> {
    const { values, positionals } = parseArgs({
      args: argv, allowPositionals: true, strict: true,
      options: { commands: { type: 'string' }, command: { type: 'string', multiple: true }, out: { type: 'string' } },
    });
    if (positionals.length !== 1) throw new UsageError(positionals.length === 0 ? 'give the DESIGN file' : `give one DESIGN file, got ${positionals.length}`);
    if (values.commands === undefined && !values.command?.length) throw new UsageError('give the commands with --commands FILE.json or --command JSON');
    if (!values.out) throw new UsageError('give the output file with --out FILE');
    const fail = (message: string): number => { io.err(`stripwright edit: ${message}`); io.err('nothing was written'); return 1; };

    const name = positionals[0]!;
    const read = await readInputText(resolve(io.cwd, name), name, DESIGN_TEXT, 'a design file (.json)');
    if (!read.ok) return fail(read.message);
    const parsed = parseDesign(read.text);
    if (!parsed.ok) {
      io.err(`stripwright edit: ${name} is not a valid design:`);
      for (const i of parsed.errors) io.err(`  ${i.message}`);
      io.err('nothing was written');
      return 1;
    }

    // Every entry with the name its messages use: the file's place in its list, or the --command's number.
    const entries: CommandEntry[] = [];
    const names: string[] = [];
    try {
      if (values.commands !== undefined) {
        const file = values.commands;
        const got = await readInputText(resolve(io.cwd, file), file, COMMANDS_INPUT, 'a command list (.json)');
        if (!got.ok) return fail(got.message);
        const list = parseCommandList(got.text, file);
        list.forEach((e, i) => { entries.push(e); names.push(list.length === 1 ? file : `${file}[${i}]`); });
      }
      (values.command ?? []).forEach((text, i) => {
        const where = `--command #${i + 1}`;
        const list = parseCommandList(text, where);
        list.forEach((e, k) => { entries.push(e); names.push(list.length === 1 ? where : `${where}[${k}]`); });
      });
      const r = applyCommandList(parsed.doc, entries, { where: (i) => names[i]! });
      await writeOutputFile(resolve(io.cwd, values.out), serializeDesign(r.doc));
      io.out(`applied ${entries.length} command${entries.length === 1 ? '' : 's'} to ${name}: ${r.labels.join(', ')}`);
      for (const line of summaryLines(r.summary)) io.out(`  ${line}`);
      io.out(`wrote ${values.out}`);
      return 0;
    } catch (e) {
      if (e instanceof InputError) return fail(e.message);
      throw e;
    }
  },
};

/** A few lines saying what changed, by record id (long lists shortened). */
export function summaryLines(s: ChangeSummary): string[] {
  const ids = (list: string[]) => (list.length > 8 ? `${list.slice(0, 8).join(', ')}, …` : list.join(', '));
  const count = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`;
  const words: Record<string, [string, string]> = { nodes: ['node', 'nodes'], segments: ['piece', 'pieces'], areas: ['area', 'areas'], phaseGroups: ['phase group', 'phase groups'] };
  const out: string[] = [];
  for (const [kind, verb] of [['added', 'added'], ['removed', 'removed']] as const) {
    const parts = Object.entries(s[kind]).filter(([, l]) => l.length).map(([list, l]) => `${count(l.length, ...words[list]!)} (${ids(l)})`);
    if (parts.length) out.push(`${verb} ${parts.join('; ')}`);
  }
  if (s.moved.length) out.push(`moved ${count(s.moved.length, 'node', 'nodes')} (${ids(s.moved)})`);
  if (s.changed.length) out.push(`changed ${s.changed.slice(0, 8).map((c) => `${c.id} (${c.fields.join(', ')})`).join('; ')}${s.changed.length > 8 ? `; and ${s.changed.length - 8} more` : ''}`);
  if (s.fields.length) out.push(`changed the design's ${s.fields.join(', ')}`);
  if (!out.length) out.push('nothing changed');
  return out;
}
