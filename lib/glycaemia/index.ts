/**
 * Glucose history: serial HbA1c and fasting glucose results → categories under a named body,
 * the run ending at the latest result, and the match with a study's exposure definition.
 */
export * from './exposure';
export * from './hba1c';
export * from './glucose';
export * from './criteria';
export * from './schema';
export * from './parse';
export * from './classify';
export * from './persistence';
export * from './match';
export * from './format';
export * from './describe';
export * from './report';
export * from './draft';
export * from './paste';
export * from './timeline';
export * from './view';
export { localIsoDate } from './dates';
