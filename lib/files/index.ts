/** Reading files the user gives: what kind of file it is, and readable problem lists. */
export * from './kind';
export * from './problems';
