// Next calls register() once when a server process starts. The processing worker runs only in the Node.js
// runtime (it needs the database driver, the file system and the S3 client), never in the edge runtime.
export async function register(): Promise<void> {
  if (process.env.NEXT_RUNTIME === 'nodejs' && process.env.NEXT_PHASE !== 'phase-production-build') {
    // The TCP peer's address for the sign-in throttle (lib/auth/client-ip.ts), stamped before Next sees a request.
    const { installPeerAddressHeader } = await import('./lib/auth/client-ip');
    installPeerAddressHeader(await import('node:http'));
    const { startAppWorker } = await import('./lib/jobs/start');
    startAppWorker();
    const { startSpoolSweeper } = await import('./lib/recordings/upload');
    startSpoolSweeper();
    // live lessons: idle ones end, buffers of a dead instance are taken over, ended ones reconciled (lib/live/end.ts)
    const { startLiveSweeper } = await import('./lib/live/end');
    const { kickLive } = await import('./lib/live/processor');
    startLiveSweeper(kickLive);
  }
}
