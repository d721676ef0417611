import 'server-only';
import type { Viewer } from '@/lib/auth/viewer';
import { getBand, loadSwingCurves } from '@/lib/bands/store';
import type { ScoreResponse } from '@/lib/contracts/targets';
import { scoreSwingAgainstBand } from '@/lib/bands/build';
import { ConflictError, NotFoundError } from '@/lib/http';
import { requireSwing } from '@/lib/auth/access';
import { scoreSwing } from './score';
import { targetForSwing } from './store';
import { swingFacts } from './swing-facts';

// GET /api/swings/:id/score: the swing against the target that applies to it (athlete-specific for its club group,
// else its coach's, else the academy default; no club label scores as irons) and, with ?band=, against a band.
// The band's top-level numbers are the lead % curve; byCurve has all four curves.
export async function scoreSwingForViewer(viewer: Viewer, swingId: number, bandId: number | null): Promise<ScoreResponse> {
  await requireSwing(viewer, swingId, 'read');
  const [facts] = await swingFacts({ swingIds: [swingId] });
  if (!facts) throw new NotFoundError('No swing with this id.');
  const target = await targetForSwing(facts.athleteId, viewer.academyId, facts.clubGroup);
  const scored = target ? scoreSwing(target, facts.values, facts.tempoRatio) : null;
  let band = null;
  if (bandId !== null) {
    const b = await getBand(viewer, bandId);
    const { usable, unusable } = await loadSwingCurves([swingId]);
    if (usable.length === 0) throw new ConflictError(`This swing cannot be compared with a band: ${unusable[0]?.reason ?? 'no data'}.`);
    const byCurve = scoreSwingAgainstBand(usable[0], b);
    band = { id: b.id, name: b.name, insidePct: byCurve.leadPct.insidePct, rms: byCurve.leadPct.rms, cmc: byCurve.leadPct.cmc, byCurve };
  }
  return {
    clubGroup: facts.clubGroup,
    clubGroupFromLabel: facts.club !== null,
    target: target && scored ? { id: target.id, name: target.name, commonPractice: target.commonPractice, checks: scored.checks, ...(scored.tempo ? { tempo: scored.tempo } : {}), summary: scored.summary } : null,
    band,
  };
}
