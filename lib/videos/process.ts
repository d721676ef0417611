// One video's processing, file to file: probe, playable mp4, poster, and the sync by the sound of impact.
// No database and no store here (lib/video/jobs.ts does that), so tests run it on generated files directly.
import { detectOnsets, syncByAudio } from '@/lib/signal/audio-onsets';
import { extractPcm, makePoster, PCM_RATE, probeVideo, transcodePlayable, type VideoProbe } from './ffmpeg';

export interface ProcessedVideo {
  probe: VideoProbe;
  offsetS: number | null;
  syncSource: 'audio' | null;
  /** why there is no automatic sync (shown with the "this is impact" button) */
  syncNote: string | null;
  onsetTimesS: number[];
}

export async function processVideoFile(input: string, playablePath: string, posterPath: string, impactTimesS: readonly number[]): Promise<ProcessedVideo> {
  const probe = await probeVideo(input);
  await transcodePlayable(input, playablePath, probe.hasAudio);
  await makePoster(playablePath, posterPath, probe.durationS);
  if (!probe.hasAudio) return { probe, offsetS: null, syncSource: null, syncNote: 'This video has no sound: scrub to the impact frame and press “This is impact”.', onsetTimesS: [] };
  const pcm = await extractPcm(input);
  if (!pcm) return { probe, offsetS: null, syncSource: null, syncNote: 'The video’s sound could not be read: sync it by hand.', onsetTimesS: [] };
  const { onsets } = detectOnsets(pcm, PCM_RATE);
  // Onsets are on the audio stream's clock; the player shows the video stream's clock.
  const times = onsets.map((o) => o.timeS + probe.audioLeadS);
  const sync = syncByAudio(times, onsets.map((o) => o.strengthDb), impactTimesS);
  return {
    probe,
    offsetS: sync.offsetS,
    syncSource: sync.offsetS === null ? null : 'audio',
    syncNote: sync.reason === null ? null : `${sync.reason} Scrub to the impact frame and press “This is impact”.`,
    onsetTimesS: times,
  };
}
