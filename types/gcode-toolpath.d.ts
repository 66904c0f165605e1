/** The parts of gcode-toolpath (npm, MIT) the G-code oracle uses; the package ships no types. */
declare module 'gcode-toolpath' {
  export interface GcodeVec { x: number; y: number; z: number }
  export interface GcodeModal { motion: string; units: string; distance: string; plane: string; spindle: string; program: string; tool: number; [k: string]: unknown }
  export interface ToolpathOptions {
    position?: Partial<GcodeVec>;
    modal?: Partial<GcodeModal>;
    addLine?: (modal: GcodeModal, v1: GcodeVec, v2: GcodeVec) => void;
    addArcCurve?: (modal: GcodeModal, v1: GcodeVec, v2: GcodeVec, v0: GcodeVec) => void;
  }
  export default class Toolpath {
    constructor(options?: ToolpathOptions);
    /** The constructor returns an interpreter with these accessors. */
    getModal(): GcodeModal;
    getPosition(): GcodeVec;
    loadFromStringSync(str: string, callback?: (data: { line: string; words: [string, number | string][] }, index: number) => void): unknown[];
  }
}
