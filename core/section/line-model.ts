/**
 * The 2-D solver behind the line-model interface (core/line/line-model.ts): a cross-section template (laminate plus
 * side copper, trench, cover) and a strip width in, the single mode out. The static Z0, εeff and ∂L/∂n come from the
 * solver's sizing tables (line-source.ts, finite differences on a graded grid); dispersion and loss are the single
 * line's models applied on top — Kirschning & Jansen 1982 εeff(f), Jansen & Kirschning 1983 Z0(f), Wheeler 1942
 * conductor loss — an approximation core/line/made-line.ts states.
 */
import { microstripFamily, SINGLE_MODE, type CrossSectionDescription, type LineModelFamily, type SingleMode } from '../line/line-model.ts';
import type { LineOptions } from '../line/types.ts';
import type { SubstrateSpec } from '../substrate/types.ts';
import { sectionTable, type SectionTemplate } from './line-source.ts';

/** A strip of `width` m in the cross-section `template` (the laminate of `substrate` with what the process adds). */
export interface SolvedSection extends CrossSectionDescription {
  readonly kind: 'solved-section';
  readonly substrate: SubstrateSpec;
  readonly template: SectionTemplate;
  readonly width: number;
  /** Dispersion and conductor-loss model choices (their crossSection is set from the template). */
  readonly options?: Omit<LineOptions, 'crossSection'>;
}

export const solvedSectionFamily: LineModelFamily<SolvedSection, SingleMode> = {
  kind: 'solved-section',
  modes: [SINGLE_MODE],
  source: 'quasi-static finite-difference field solution (core/section) with the microstrip dispersion and loss models on top',
  evaluate(s, f) {
    const table = sectionTable(s.template);
    return microstripFamily.evaluate({ kind: 'microstrip', substrate: s.substrate, width: s.width, options: { ...s.options, crossSection: table } }, f);
  },
};
