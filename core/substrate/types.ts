/** The laminate and copper of a design, SI units. Owned by the substrate layer so line models can use it. */
export interface SubstrateSpec {
  /** Generic preset this came from, if any (informational; the numbers below rule). */
  preset?: string;
  /** Relative permittivity at `fMeasure` (or frequency-independent). */
  er: number;
  /** Dielectric height, m. */
  h: number;
  /** Copper thickness, m (35 µm = 1 oz). */
  t: number;
  /** Loss tangent at `fMeasure`. */
  tanDelta: number;
  /** Conductor conductivity, S/m (annealed copper 5.8e7). */
  sigma: number;
  /** RMS surface roughness, m. */
  roughness: number;
  /** Carry εr and tanδ from fMeasure to other frequencies with the wideband Debye model (off by default). */
  dielectricModel?: { kind: 'constant' } | {
    kind: 'wideband-debye';
    /** Frequency at which `er` and `tanDelta` were measured, Hz. */
    fMeasure: number;
    /** Lower and upper corner of the model's loss band, Hz (defaults 1 kHz and 1 THz). */
    fLow?: number;
    fHigh?: number;
  };
}
