/**
 * Moved to lib/consultation/formValues.ts (the pure form-to-scenario mapping belongs in lib/).
 * Kept as a re-export only so that imports of the old path (app/checkups/workerHandOver.ts)
 * keep working; import from '@/lib/consultation/formValues' in new code.
 */
export * from '@/lib/consultation/formValues';
