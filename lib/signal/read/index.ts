// Reading recordings, sensor layouts and import profiles (README "Recording CSV", "Sensor layout", "Import profile").
import type { ImportProfile, RawRecording } from '../types';
import { createRecordingReader } from './reader';

export { createRecordingReader, MIN_SAMPLES, type RecordingReader } from './reader';
export { parseLayout, parseProfile, sensorLayoutSchema, importProfileSchema, sensorSpecSchema } from './schemas';
export { compareSensorIds } from './columns';

/** Reads a whole recording held in one string; the same result as streaming it through createRecordingReader. */
export function parseRecording(text: string, opts: { profile?: ImportProfile } = {}): RawRecording {
  const reader = createRecordingReader(opts);
  reader.push(text);
  return reader.end();
}
