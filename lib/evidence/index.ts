/** Evidence entries: the schema, validation, the JSON file, search and the demo entries. */
export * from './schema';
export * from './parse';
export * from './file';
export * from './search';
export * from './demo';
export * from './exposureForm';
