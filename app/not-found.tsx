import Link from 'next/link';
import { Wordmark } from '@/components/brand/logo';

export default function NotFound() {
  return (
    <main className="mx-auto flex min-h-screen max-w-md flex-col items-center justify-center gap-4 px-6 text-center">
      <Wordmark />
      <h1 className="text-xl font-semibold">Page not found</h1>
      <p className="text-sm text-ink-muted">This page does not exist, or it is not on your roster.</p>
      <Link href="/" className="text-sm font-medium text-accent hover:underline">
        Back to your overview
      </Link>
    </main>
  );
}
