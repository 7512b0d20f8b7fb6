/**
 * Moved to lib/consultation/fromScenario.ts (pure mapping, scenario → form values). Kept as a
 * re-export only so that imports of the old path (app/checkups/workerHandOver.ts) keep working;
 * import from '@/lib/consultation/fromScenario' in new code.
 */
export * from '@/lib/consultation/fromScenario';
