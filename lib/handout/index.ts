/** The printed handout: editable blocks, templates and their file format, paper sizes, content. */
export * from './blocks';
export * from './template';
export * from './paper';
export * from './content';
