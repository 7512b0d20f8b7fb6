/**
 * Kept so older import paths keep compiling: the shared schema helpers live in
 * lib/validation/issues.ts. Import from there.
 */
export { pickUnionBranch, toIssues } from '../validation/issues';
