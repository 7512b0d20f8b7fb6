/** The consultation screen's view model (./view.ts). */
export * from './view';
export * from './entry';
