/**
 * The one sweep of a design, for every face (`stripwright sweep`, the app's response worker): the network of the
 * revision from the pipeline (sized once, shared with the other stages), solved with the element values the pipeline
 * keeps across revisions (core/network/sweepValues.ts: a drag that changes two lengths re-computes two lines and the
 * junctions at their ends), and only the S entries asked for (`entries`; absent: all). The numbers are those of
 * `sweepNetwork` on a fresh netlist, to the bit where every entry is asked and to rounding (|ΔS| < 1e-12) where some
 * are (test/unit/network-sweep-values.test.ts).
 */
import type { DesignDoc } from '../design/types.ts';
import type { SizedNetlist } from '../network/fromSized.ts';
import type { NetworkResponse } from '../network/response.ts';
import { sweepNetwork, type SweepOptions, type SweepSettings } from '../network/sweep.ts';
import { compileNetwork, type CompiledNetwork } from '../network/mna.ts';
import type { DesignPipeline } from './stages.ts';

export interface DesignSweep { response: NetworkResponse; net: SizedNetlist }

export async function sweepDesign(pipeline: DesignPipeline, doc: DesignDoc, frequencies: SweepSettings | ArrayLike<number>, opts: Omit<SweepOptions, 'values'> = {}): Promise<DesignSweep> {
  const net = pipeline.netlist(doc);
  let cn = compiled.get(net);
  if (!cn) { cn = compileNetwork(net, pipeline.values); compiled.set(net, cn); }
  const response = await sweepNetwork(cn, frequencies, { ...opts, values: pipeline.values });
  return { response, net };
}

/** The compiled form of each revision's network (a coarse pass and the full sweep of one revision share it). */
const compiled = new WeakMap<SizedNetlist, CompiledNetwork>();
