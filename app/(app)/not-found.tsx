import Link from 'next/link';

export default function AppNotFound() {
  return (
    <div className="rounded-lg border border-surface-line bg-surface p-6">
      <h1 className="text-lg font-semibold">Not found</h1>
      <p className="mt-1 text-sm text-ink-muted">This page does not exist, or the athlete is not on your roster.</p>
      <Link href="/" className="mt-4 inline-block text-sm font-medium text-accent hover:underline">
        Back to your overview
      </Link>
    </div>
  );
}
