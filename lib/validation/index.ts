/** Shared schema helpers: zod failures to issues (./issues.ts) and field builders (./fields.ts). */
export * from './issues';
export * from './fields';
