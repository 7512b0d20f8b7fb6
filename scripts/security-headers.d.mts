/** Types for scripts/security-headers.mjs, so TypeScript tests can import it. */
export declare const SCRIPT_HASHES_PLACEHOLDER: string;
export interface SecurityHeaderOptions {
  production: boolean;
  scriptHashes?: readonly string[] | null;
}
export declare function contentSecurityPolicy(options: SecurityHeaderOptions): string;
export declare function securityHeaders(options: SecurityHeaderOptions): { key: string; value: string }[];
