/**
 * Dielectric loss by the filling-factor form.
 *
 * Sources: J. D. Welch and H. J. Pratt, "Losses in microstrip transmission systems for integrated microwave
 * circuits", NEREM Record, vol. 8, pp. 100–101, 1966; Pucel, Massé and Hartwig, IEEE Trans. MTT 16(6), 1968:
 *     q = (εe − 1)/(εr − 1),   αd = (π f/c0)·(εr/√εe)·q·tanδ        [Np/m]
 * The published form uses the static εe; here εe = εe(f) (as the scikit-rf table test/fixtures/line/line-reference.csv; the two differ by a median
 * 0.4 %, the project's own comparison). Units: f Hz, result Np/m.
 */
import { C0 } from '../units/constants.ts';

export function fillingFactorAlphaD(f: number, er: number, epsEff: number, tanDelta: number): number {
  const q = (epsEff - 1) / (er - 1);
  return ((Math.PI * f) / C0) * (er / Math.sqrt(epsEff)) * q * tanDelta;
}
