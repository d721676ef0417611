// Unit conversion for shot values. Exact definitions (NIST SP 811, appendix B): 1 yd = 0.9144 m, 1 mph = 0.44704 m/s,
// 1 km/h = 1000 m / 3600 s. Stored values are SI: m/s, m, degrees, rpm.
import type { DistanceUnit, SpeedUnit, UnitSystem } from '@/lib/contracts/shots';

export const METRES_PER_YARD = 0.9144;
export const MPS_PER_MPH = 0.44704;
export const MPS_PER_KMH = 1000 / 3600;

export function speedToMps(value: number, unit: SpeedUnit): number {
  if (unit === 'mph') return value * MPS_PER_MPH;
  if (unit === 'km/h') return value * MPS_PER_KMH;
  return value;
}

export function distanceToM(value: number, unit: DistanceUnit): number {
  return unit === 'yd' ? value * METRES_PER_YARD : value;
}

/** Display units of each system: metric shows km/h and metres (our choice: km/h reads better than m/s at the range). */
export function displayUnits(system: UnitSystem): { speed: SpeedUnit; distance: DistanceUnit } {
  return system === 'imperial' ? { speed: 'mph', distance: 'yd' } : { speed: 'km/h', distance: 'm' };
}

export function speedFromMps(mps: number, unit: SpeedUnit): number {
  if (unit === 'mph') return mps / MPS_PER_MPH;
  if (unit === 'km/h') return mps / MPS_PER_KMH;
  return mps;
}

export function distanceFromM(m: number, unit: DistanceUnit): number {
  return unit === 'yd' ? m / METRES_PER_YARD : m;
}
