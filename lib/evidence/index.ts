/** Evidence entries: the schema, validation and the demo entries. */
export * from './schema';
export * from './parse';
export * from './demo';
