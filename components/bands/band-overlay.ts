'use client';
// Loads one reference band (GET /api/bands/:id) and turns its lead % curve into the viewer's ReferenceBand: the band
// lives on the registered 0-100 % swing axis, and the viewer carries it onto this swing's time through its events.
import { useMemo } from 'react';
import useSWR from 'swr';
import type { ReferenceBand } from '@/components/charts';
import { fetchJson } from '@/lib/fetcher';
import { bandDetailSchema, bandsResponseSchema, type BandDetail } from '@/lib/contracts/bands';

const fetchBand = fetchJson(bandDetailSchema);
const fetchBands = fetchJson(bandsResponseSchema);

export function useBandList() {
  return useSWR('/api/bands', fetchBands, { revalidateOnFocus: false });
}

/** band -> ReferenceBand for the lead % chart; null when the band has no lead % curve */
export function leadReferenceBand(band: BandDetail): ReferenceBand | null {
  const curve = band.curves.leadPct;
  if (!curve) return null;
  const l = band.landmarks;
  return {
    label: `${band.name} (typical range ×${band.k})`,
    axis: 'swing-pct',
    x: Float64Array.from(band.axis),
    lower: Float64Array.from(curve.lower),
    upper: Float64Array.from(curve.upper),
    mean: Float64Array.from(curve.mean),
    landmarks: Float64Array.from([l.address, l.top, l.transition, l.impact, l.finish]),
  };
}

export function useBandOverlay(bandId: number | null) {
  const { data, error, isLoading } = useSWR(bandId != null ? `/api/bands/${bandId}` : null, fetchBand, { revalidateOnFocus: false });
  const band = useMemo(() => (data ? leadReferenceBand(data.band) : null), [data]);
  return { band: bandId != null ? band : null, error, loading: isLoading };
}
