/** Types for scripts/build-cli.mjs, so TypeScript tests can import it. */
export declare const ROOT: string;
export declare const ENTRY: string;
export declare const DIST_FILE: string;
export declare const SOURCES: readonly string[];
export declare function newestMtimeMs(paths: readonly string[]): number;
export declare function isStale(distFile?: string, sources?: readonly string[]): boolean;
export declare function buildCli(options?: { entry?: string; outfile?: string }): Promise<string>;
export declare const NODE_BUNDLE_OPTIONS: Readonly<{
  bundle: true;
  platform: 'node';
  format: 'esm';
  target: string;
  tsconfig: string;
  write: false;
  logLevel: 'silent';
}>;
