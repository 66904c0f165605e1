/**
 * Checks of targets and tolerances across records (format 3): target ids unique, each figure given the ports or the
 * phase group it needs, ports that are port nodes, a band whose start is not above its stop; one tolerance per
 * quantity, with a spread in a sane range for its unit (a slip such as 0.05 meaning millimetres is caught here).
 */
import type { DesignDoc } from './types.ts';
import { issue, type DesignIssue } from './issues.ts';
import { FIGURE_PORTS, TOLERANCE_WORDS, type ToleranceQuantity } from './targets.ts';

/** Largest sensible spread per quantity, with words for the message. */
const SPREAD_LIMIT: Readonly<Record<ToleranceQuantity, [number, string]>> = {
  er: [1, 'at most 1 (εr ± 1 is already another laminate)'],
  h: [1e-3, 'at most 1 mm (0.0001 is 0.1 mm)'],
  tanDelta: [0.05, 'at most 0.05'],
  t: [100e-6, 'at most 100 µm (0.000005 is 5 µm)'],
  'etch-bias': [1e-3, 'at most 1 mm (0.00001 is 10 µm)'],
  'tool-width': [1e-3, 'at most 1 mm (0.00002 is 20 µm)'],
  'mill-depth': [1e-3, 'at most 1 mm (0.00002 is 20 µm)'],
  width: [1e-3, 'at most 1 mm (0.00001 is 10 µm)'],
  resistor: [0.5, 'a fraction of at most 0.5 (0.01 is 1 %)'],
  capacitor: [0.5, 'a fraction of at most 0.5 (0.05 is 5 %)'],
  inductor: [0.5, 'a fraction of at most 0.5 (0.05 is 5 %)'],
};

export function crossCheckTargets(doc: DesignDoc, errors: DesignIssue[]): void {
  const targets = Array.isArray(doc.targets) ? doc.targets : [];
  const tolerances = Array.isArray(doc.tolerances) ? doc.tolerances : [];
  const ports = new Set(doc.nodes.filter((n) => n.kind === 'port').map((n) => n.id));
  const groups = new Set(doc.phaseGroups.map((g) => g.id));
  const seen = new Set<string>();
  targets.forEach((t, i) => {
    const at = `targets[${i}]`;
    if (seen.has(t.id)) errors.push(issue('invalid-design', `${at}.id`, 'an id not used by another target', JSON.stringify(t.id), { fix: 'give each target its own id' }));
    seen.add(t.id);
    const need = FIGURE_PORTS[t.figure];
    if (need > 0) {
      const list = t.ports ?? [];
      if (list.length !== need) errors.push(issue('invalid-design', `${at}.ports`, `${need === 1 ? 'one port id' : 'two port ids [from, to]'} for ${t.figure}`, `${list.length}`, { fix: need === 1 ? 'name one port' : 'name the port the signal enters and the one it leaves' }));
      list.forEach((p, k) => { if (!ports.has(p)) errors.push(issue('invalid-design', `${at}.ports[${k}]`, 'the id of a port node', JSON.stringify(p), { fix: 'name a port of this design (its id), or add the port' })); });
      if (list.length === 2 && list[0] === list[1]) errors.push(issue('invalid-design', `${at}.ports[1]`, 'a port other than the first', JSON.stringify(list[1]), { fix: 'name two different ports' }));
    } else if (t.group === undefined || !groups.has(t.group)) {
      errors.push(issue('invalid-design', `${at}.group`, `the id of a phase group (${t.figure} compares a group's outputs)`, t.group === undefined ? 'nothing' : JSON.stringify(t.group), { fix: 'name a phase group of this design, or make one for these outputs' }));
    }
    if (!(t.band.start <= t.band.stop)) errors.push(issue('invalid-design', `${at}.band.stop`, `a stop not below the start (${t.band.start} Hz)`, String(t.band.stop), { fix: 'swap start and stop, or make them equal for one frequency' }));
  });
  const quantities = new Set<string>();
  tolerances.forEach((x, i) => {
    const at = `tolerances[${i}]`;
    if (quantities.has(x.quantity)) errors.push(issue('invalid-design', `${at}.quantity`, 'each quantity once (its scope says board or piece)', JSON.stringify(x.quantity), { fix: 'keep one entry for this quantity' }));
    quantities.add(x.quantity);
    const [max, words] = SPREAD_LIMIT[x.quantity];
    if (x.spread > max) errors.push(issue('invalid-design', `${at}.spread`, `a spread of ${TOLERANCE_WORDS[x.quantity].name} ${words}`, String(x.spread), { fix: 'enter the spread in SI units (metres for lengths), within that bound' }));
  });
}
