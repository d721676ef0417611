// Types of scripts/build-bundles.mjs for the TypeScript scripts and tests that call it.
export declare const ROOT: string;
export declare const BUILD_DIR: string;
export type BundleName = 'analyze' | 'analyze-worker' | 'job-thread';
export declare const BUNDLES: Record<BundleName, { entry: string; out: string; split?: boolean; inputs: string[] }>;
export declare function bundlePath(name: BundleName): string;
export declare function isStale(name: BundleName): boolean;
export declare function buildBundle(name: BundleName): Promise<string>;
export declare function buildBundles(options?: { force?: boolean; names?: BundleName[] }): Promise<BundleName[]>;
