// `npm run analyze`: runs the compiled command (.build/analyze.mjs, made by scripts/build-bundles.mjs in `npm ci`'s
// prepare step), rebuilding it first when it is missing or older than its sources. No tsx on this path.
import { bundlePath, isStale, buildBundle } from './build-bundles.mjs';

if (isStale('analyze')) await buildBundle('analyze');
await import(bundlePath('analyze'));
