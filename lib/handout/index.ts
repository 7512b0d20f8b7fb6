/** The printed handout: editable blocks, templates and their file format, paper sizes, the sheet view model. */
export * from './blocks';
export * from './template';
export * from './paper';
export * from './dates';
export * from './contact';
export * from './illustrative';
export * from './ownResults';
export * from './content';
export * from './sheet';
export * from './page';
export * from './templateRecords';
