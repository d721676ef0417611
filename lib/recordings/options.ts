// What an uploader asks for when a recording is processed (kept in recordings.options as JSON), and how that
// becomes the signal core's layout, import profile and analysis options.
import { z } from 'zod';
import {
  builtinLayout,
  importProfileSchema,
  parseLayout,
  sensorLayoutSchema,
  SignalInputError,
  type AnalyzeOptions,
  type ImportProfile,
  type SensorLayout,
} from '@/lib/signal';

export const recordingOptionsSchema = z.object({
  /** a built-in preset id, or a whole layout; null = the layout the file names in its `# layout:` line */
  layout: z.union([z.object({ preset: z.string().min(1) }), z.object({ custom: sensorLayoutSchema })]).nullable(),
  profile: importProfileSchema.transform((p) => p as ImportProfile).nullable(),
  /** the uploader's explicit choice; null = the file's metadata decides, else the athlete's profile */
  handedness: z.enum(['right', 'left']).nullable(),
  stanceWidthMm: z.number().positive().nullable(),
  /** the athlete's profile at upload time: used only where the file's metadata says nothing */
  profileHandedness: z.enum(['right', 'left']).nullable().optional(),
  profileStanceWidthMm: z.number().positive().nullable().optional(),
  /** null = the core's default cutoff */
  cutoffHz: z.number().positive().nullable(),
});

export type RecordingOptions = z.infer<typeof recordingOptionsSchema>;

/** The sensor layout for a recording: the chosen one, else the built-in preset its metadata names. */
export function resolveLayout(options: RecordingOptions, metadata: Record<string, string>): SensorLayout {
  if (options.layout && 'custom' in options.layout) return parseLayout(options.layout.custom);
  const id = options.layout?.preset ?? metadata.layout;
  if (id === undefined) {
    throw new SignalInputError('no-layout', 'the file names no sensor layout (no "# layout:" line); choose a layout preset or upload a layout file');
  }
  const layout = builtinLayout(id);
  if (!layout) throw new SignalInputError('unknown-layout', `layout "${id}" is not a built-in preset; upload a layout file instead`);
  return layout;
}

/**
 * Parameter precedence: the explicit choice in the upload form > the file's own metadata > the athlete's profile >
 * the core's defaults (lib/signal analyzeRecording applies the last three, so the file is never overridden silently).
 */
export function analyzeOptionsOf(options: RecordingOptions, promote: readonly number[] = []): AnalyzeOptions {
  return {
    handedness: options.handedness ?? undefined,
    stanceWidthMm: options.stanceWidthMm ?? undefined,
    cutoffHz: options.cutoffHz ?? undefined,
    fallback: { handedness: options.profileHandedness ?? undefined, stanceWidthMm: options.profileStanceWidthMm ?? undefined },
    ...(promote.length ? { promote } : {}),
  };
}

export function profileOf(options: RecordingOptions): ImportProfile | undefined {
  return options.profile ?? undefined;
}
