import 'server-only';
// POST /api/recordings/:id/videos: busboy streams each file part to a spool file, the original goes into the raw
// store as uploaded, and a queued videos row is its job.
import { randomUUID } from 'node:crypto';
import { rm } from 'node:fs/promises';
import { extname } from 'node:path';
import type { Viewer } from '@/lib/auth/viewer';
import { MAX_VIDEO_BYTES, VIDEO_EXTENSIONS, type VideoUploaded } from '@/lib/contracts/videos';
import { db } from '@/lib/db/client';
import { getEnv } from '@/lib/env';
import { BadUploadError, readMultipart } from '@/lib/recordings/multipart';
import { spoolDir } from '@/lib/recordings/upload';
import { getStore } from '@/lib/storage';
import { wakeVideoWorker } from './worker';

export async function receiveVideos(viewer: Viewer, recordingId: number, athleteId: number, request: Request): Promise<VideoUploaded> {
  const form = await readMultipart(request, { maxFileBytes: MAX_VIDEO_BYTES, maxFiles: Math.max(2, getEnv().MAX_UPLOAD_FILES) }, spoolDir());
  try {
    if (form.files.length === 0) throw new BadUploadError('no_file', 'No video was sent; add at least one file part named "file".');
    for (const file of form.files) {
      const ext = extname(file.filename).slice(1).toLowerCase();
      if (!(VIDEO_EXTENSIONS as readonly string[]).includes(ext)) {
        throw new BadUploadError('bad_video_type', `"${file.filename}" is not an mp4, mov or webm video (form field "file").`);
      }
    }
    const store = getStore();
    const out: VideoUploaded['videos'] = [];
    for (const file of form.files) {
      const key = `videos/${athleteId}/${randomUUID()}${extname(file.filename).toLowerCase()}`;
      await store.putFile(key, file.path, file.byteSize);
      try {
        const [id] = await db('videos').insert({
          recording_id: recordingId,
          uploaded_by: viewer.id,
          filename: file.filename.slice(0, 255),
          byte_size: file.byteSize,
          original_key: key,
          status: 'queued',
        });
        out.push({ id: Number(id), status: 'queued' });
      } catch (error) {
        await store.remove(key).catch(() => undefined);
        throw error;
      }
    }
    wakeVideoWorker();
    return { videos: out };
  } finally {
    await Promise.all(form.files.map((f) => rm(f.path, { force: true })));
  }
}
