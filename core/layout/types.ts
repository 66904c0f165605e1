/**
 * Results of the layout layer. Everything in SI units (m, Hz, Ω, F, H, radians) except fields whose name says
 * otherwise (`Deg`, `Db`).
 *
 * For the network solver: a SizedDesign holds all it needs to build the circuit.
 * - `pieces`: one per design segment, in document order. Each names its end nodes (`a`, `b`, same ids as the
 *   design), gives its kind, its copper width(s), and `length` — the physical centreline length of line copper that
 *   the network should model as a transmission line between the two nodes (compensations already applied). Tapers
 *   carry `sections` (piecewise-uniform approximation, a → b). Lumped parts carry `part` (value and footprint).
 *   S-parameter blocks carry `sparams` (the Touchstone text from the design).
 * - `nodes`: one per design node, with the discontinuity data a network needs at that node: an open end's
 *   capacitance, a via's L and R at f0 (and the via geometry, to recompute R across the band), a tee's arms (their
 *   static Z and εeff, for the reference planes and turns ratio at every frequency) and whether it is modelled, a
 *   width step's L/C and which parts of it hold, a port's reference impedance.
 * - `junctions`: the design's junction choice as sized ('modelled': published models in sizing and network;
 *   'ideal': arms joined at the junction centre, for comparison).
 */
import type { Vec2 } from '../geometry/types.ts';
import type { BendStyle, JunctionChoice, SmdSize, ViaSpec } from '../design/types.ts';
import type { Warning } from '../util/warnings.ts';
import type { GuidedWave } from '../line/coupled-types.ts';
import type { MiterCut } from '../discontinuity/douvilleJames1978Miter.ts';
import type { TeeArm, TeeJunction } from '../discontinuity/hammerstad1981TeeJunction.ts';
import type { StepModel } from '../discontinuity/gargBahl1978Step.ts';

export type PieceKind = 'line' | 'taper' | 'lumped' | 'sparams' | 'coupled';

/** One correction to a piece's length, reported whether applied or only shown. */
export interface Compensation {
  /**
   * What kind of correction: 'open-end', 'via', 'arc-bend', 'miter-bend', 'tee-planes', 'width-step', 'cross',
   * 'junction', 'lumped-pad', 'launch-pad'.
   */
  model: string;
  /** Citation or 'common practice'. */
  source: string;
  /** How much the piece's copper is SHORTENED by it, m (negative = lengthened). */
  amount_m: number;
  /** Applied to the copper (true) or advisory only (false). */
  applied: boolean;
  /** At which end node. */
  node: string;
  note: string;
  /** For junctions (tees, steps, crosses): the model, its validity and what it leaves at f0. */
  junction?: JunctionInfo;
}

/** How one junction is treated, as reported on each piece that meets it. */
export interface JunctionInfo {
  kind: 'tee' | 'step' | 'cross' | 'other';
  /** This piece's place at the junction. */
  role: 'main' | 'branch' | 'wide' | 'narrow' | 'arm';
  /** The published model is in the sweep (and, for tees, in the sizing). False: ideal (joined at the centre). */
  modelled: boolean;
  /** Inside the model's validity (its fit ranges and our stated limits) at f0. */
  inRange: boolean;
  /** Validity in words. */
  validity: string;
  /**
   * What the sized lengths do not take out, at f0: the extra transmission phase (degrees) and the reflection
   * (|ΔS11| in dB against an ideal junction) — null where no model exists to estimate it (crosses).
   */
  residual: { phaseDeg: number; reflectionDb: number } | null;
}

/** Line figures at f0 (from the line model, core/line). */
export interface LineFigures extends GuidedWave {
  /** Total attenuation at f0, dB/m. */
  lossDbPerM: number;
  delayPerM: number;
}

export interface TaperSection {
  width: number;
  length: number;
  /** Z0 at f0, Ω. */
  z0: number;
  /** Phase constant at f0, rad/m. */
  beta: number;
  lossDbPerM: number;
}

import type { SmdFootprint } from '../design/footprints.ts';
export type { SmdFootprint };

export interface SizedPiece {
  id: string;
  kind: PieceKind;
  /** End nodes (design node ids). */
  a: string;
  b: string;
  label?: string;
  /** Characteristic impedance at f0, Ω (taper: at end a; lumped/sparams: of the line width at the pads). */
  z0: number;
  /** Copper width, m (taper: at end a). */
  width: number;
  /** Taper: width at end b, m. */
  widthB?: number;
  z0B?: number;
  /** What the design asked for: the length before compensations, m. */
  nominalLength: number;
  /** Physical line length the network models between a and b, m (after applied compensations). */
  length: number;
  /** Distance between the two node positions along the centreline (through corner points), m. */
  span: number;
  /** Electrical length of `length` at f0, degrees. */
  deg: number;
  /** Electrical length the piece realises with its applied end corrections, degrees (the design's target). */
  effectiveDeg: number;
  line: LineFigures | null;
  /** Sized from the as-made cross-section: the shift from plain microstrip (absent for plain microstrip sizing). */
  asMade?: AsMadeShift;
  /** Taper: piecewise-uniform sections from a to b (≥ 20 per guided wavelength at the top of the band). */
  sections?: TaperSection[];
  /** Taper: copper widths at equally spaced points from a (first) to b (last), for the outline. */
  taperWidths?: number[];
  part?: { part: 'resistor' | 'capacitor' | 'inductor'; value: number; footprint: SmdFootprint };
  sparams?: { name: string; touchstone: string };
  /**
   * Coupled pair (kind 'coupled'): each of its two strips is a piece (the second's id ends in ':2'), placed and
   * corrected at its ends like a line of `width`; `line.beta` is the modes' mean. The network models the pair once,
   * as a four-port from the first strip's a, b and the second strip's a, b (its c, d in the design).
   */
  pair?: import('./coupledPair.ts').PairData;
  compensations: Compensation[];
  warnings: Warning[];
}

export interface SizedNode {
  id: string;
  kind: 'port' | 'vertex' | 'junction' | 'open' | 'short';
  /** Drawn position. */
  at: Vec2;
  /** Placed position (after sizing). */
  pos: Vec2;
  /** Segments meeting here, in document order. */
  segments: string[];
  port?: { zRef: number; heading: number; launch?: { padWidth: number; padLength: number; pinDrill?: number } };
  bend?: {
    style: BendStyle;
    /** Turn angle, radians (0 = straight on). */
    turn: number;
    /** Width at the bend, m (the narrower of the two pieces when they differ). */
    width: number;
    miter?: MiterCut;
    arc?: { radius: number; tangent: number; arcLength: number };
  };
  /**
   * Width step, when the pieces meeting at a vertex differ in width. Side 1 is the wide one. `modelled`: its L/C go
   * into the network (each part only where its fit holds: `cValid`, `lValid`); false at a bend (the fit is for an
   * in-line step) or with ideal junctions.
   */
  step?: StepModel & { wide: string; narrow: string; modelled: boolean };
  /**
   * T-junction (three line pieces, two in line and a perpendicular branch). `arms` are the static Z0 and εeff the
   * model takes (main arms in the order of `main`); `atF0` the model at f0; `modelled` whether the sizing moved the
   * arms' reference planes and the network uses the model (else the arms join at the centre).
   */
  tee?: { main: [string, string]; branch: string; arms: { main: [TeeArm, TeeArm]; branch: TeeArm }; atF0: TeeJunction; modelled: boolean };
  cross?: { arms: string[] };
  open?: { dl: number; capacitance: number };
  via?: ViaSpec & { L: number; R: number; X: number; dlEquivalent: number };
  warnings: Warning[];
}

/** A problem that makes the layout impossible as asked; names the pieces and nodes involved. */
export interface LayoutProblem {
  code: 'dangling-end' | 'bad-topology' | 'too-short' | 'loop-mismatch' | 'overlap' | 'bad-value' | 'too-large';
  message: string;
  subjects: string[];
}

export interface SizedDesign {
  name: string;
  f0: number;
  /** The junction choice the design was sized with. */
  junctions: JunctionChoice;
  band: { start: number; stop: number };
  pieces: SizedPiece[];
  nodes: SizedNode[];
  /** Placed centreline of each piece (a → b), for paths and faces. */
  centrelines: Record<string, Vec2[]>;
  /** The port placement started from. */
  anchor: string | null;
  problems: LayoutProblem[];
  warnings: Warning[];
  /** The design it came from (kept for geometry: areas, board, process). */
  doc: import('../design/types.ts').DesignDoc;
  /** The line options the pieces were sized with (with the as-made cross-section tables, when any): pass them to
   * the network (netlistFromSized(sized, { line: sized.lineOptions })) so the sweep uses the same lines. */
  lineOptions?: import('../line/index.ts').LineOptions;
  /** Non-enumerable, set when sizing was given its own line models (SizeOptions.models): paths and the network
   * default to them, so one plant reaches every stage. */
  lineModels?: import('../line/index.ts').LineModels;
}

/** A line sized as made, beside what plain microstrip would give for the same copper width (at f0). */
export interface AsMadeShift {
  /** What the line was sized from, in words. */
  label: string;
  /** Plain microstrip Z0 and εeff of the same width at f0 (Ω; −). */
  z0Plain: number;
  epsEffPlain: number;
  /** The as-made Z0 and εeff at f0. */
  z0: number;
  epsEff: number;
  /** Estimated relative error of the field solution's Z0. */
  z0Error: number;
}
