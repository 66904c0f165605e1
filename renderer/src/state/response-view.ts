/**
 * Plain data the response panel draws, shared by the panel, its plots and anything that adds traces to them.
 *
 * Overlays: another part of the app (measured data beside the simulation, for one) adds traces by setting
 * `compute.overlays` to a list of `OverlayTrace`s. Each is drawn on the plot whose view it names, over its own
 * frequencies (no common grid is needed), listed in the legend and read at every marker like a swept trace.
 */
import type { DesignDoc } from '../../../core/index.ts';

export type ResponseView = 'db' | 'phase' | 'delay';

export interface TraceStyle {
  /** CSS colour (a theme variable such as 'var(--ok)' is resolved by the plot). */
  colour: string;
  /** Dash pattern in px; empty or absent = solid. */
  dash?: readonly number[];
  /** Line width in px (default 1.5). */
  width?: number;
}

export interface OverlayTrace {
  label: string;
  /** Which plot it belongs on: |S| dB, phase (degrees, any branch: the plot wraps it) or group delay (s). */
  view: ResponseView;
  /** Strictly increasing frequencies (Hz) and the values there. */
  points: { f: readonly number[]; y: readonly number[] };
  style: TraceStyle;
}

