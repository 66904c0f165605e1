/**
 * Shop check for side copper on lines sized as made (design asMade): stitched side copper needs a via fence along
 * each line, at a pitch of at most a tenth of the wavelength in the dielectric at the top of the band — common
 * practice for keeping the fence from letting the side copper resonate (a rule of thumb, not a published bound;
 * tighter pitches are often used). Floating side copper is said to be floating.
 */
import { C0 } from '../units/constants.ts';
import type { DesignDoc } from '../design/types.ts';
import { asMadeTemplate } from './as-made.ts';
import type { Finding } from './checks.ts';

/** Largest via-fence pitch, m: λ/10 in the substrate at the band's top frequency (common practice). */
export function fencePitchLimit(doc: DesignDoc): number {
  const fTop = Math.max(doc.frequency.f0, doc.frequency.band?.stop ?? 0);
  return C0 / (fTop * Math.sqrt(doc.substrate.er)) / 10;
}

export function fenceFindings(doc: DesignDoc): Finding[] {
  const t = asMadeTemplate(doc);
  if (!t || !t.side) return [];
  const mm = (x: number) => (x * 1e3).toFixed(2);
  const limit = fencePitchLimit(doc);
  const fTop = Math.max(doc.frequency.f0, doc.frequency.band?.stop ?? 0);
  if (t.side.connection === 'floating') {
    return [{ severity: 'info', code: 'via-fence', subjects: [], message: `side copper is sized as floating (zero net charge, no vias): unstitched copper beside the lines can resonate where its length nears half a wavelength`, fix: `stitch it to the ground plane with vias at most ${mm(limit)} mm apart and set side copper to "stitched"` }];
  }
  const pitch = doc.asMade?.fencePitch;
  if (pitch === undefined) {
    return [{ severity: 'info', code: 'via-fence', subjects: [], message: `lines are sized with stitched side copper: drill a via fence along each line, vias at most ${mm(limit)} mm apart (λ/10 in the substrate at ${(fTop / 1e9).toFixed(3)} GHz, common practice)`, fix: 'set the fence pitch in the cross-section settings to have it checked' }];
  }
  if (pitch > limit) {
    return [{ severity: 'warning', code: 'via-fence', subjects: [], message: `the via fence's pitch ${mm(pitch)} mm is more than λ/10 in the substrate at ${(fTop / 1e9).toFixed(3)} GHz (${mm(limit)} mm, common practice)`, fix: `place the vias at most ${mm(limit)} mm apart` }];
  }
  return [];
}
