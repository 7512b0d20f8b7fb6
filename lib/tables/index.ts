/** Population tables: the schema, validation, stratum lookup and the demo tables. */
export * from './schema';
export * from './parse';
export * from './lookup';
export * from './demo';
