/**
 * Warnings travel with values as data; the core never prints. A face shows them next to the number.
 */
export type WarningCode =
  | 'validity'          // a model used outside its published range
  | 'higher-order-mode' // the frequency nears or passes a higher-order-mode or surface-wave threshold
  | 'thin-conductor'    // copper thinner than a few skin depths
  | 'advisory-model'    // a model not yet verified against its paper: value shown, not applied
  | 'fabrication'       // a fabrication-process concern
  | 'phase'             // a path out of its phase tolerance
  | 'loss'              // a loss budget exceeded
  | 'network'           // numerical conditioning of a solve
  | 'note';

export interface Warning {
  code: WarningCode;
  /** Human-readable, says what to change where possible. */
  message: string;
  /** The model or check that raised it, e.g. 'hammerstad-jensen-1980'. */
  source?: string;
  /** Field or piece ids it concerns. */
  subjects?: string[];
  severity: 'info' | 'warning' | 'error';
}

export function warn(code: WarningCode, message: string, extra: Partial<Omit<Warning, 'code' | 'message'>> = {}): Warning {
  return { code, message, severity: 'warning', ...extra };
}
