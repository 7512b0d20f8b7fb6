/** Types for scripts/postbuild.mjs, so TypeScript tests can import it. */
export declare const ROOT: string;
export declare function inlineScripts(html: string): string[];
export declare function hashSource(text: string): string;
export declare function scriptHashes(pages: readonly string[]): string[];
export declare function pageRoutes(files: readonly string[]): Record<string, string>;
export declare function nginxHeaderLines(headers: readonly { key: string; value: string }[]): string;
export declare function headersFile(headers: readonly { key: string; value: string }[]): string;
export declare function postbuild(options?: { root?: string; staticExport?: boolean }): Promise<string[]>;
