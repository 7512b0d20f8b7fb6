/** Plain-language wording: patient sentences, clinician sentences, the caution, formatting. */
export * from './format';
export * from './people';
export * from './caution';
export * from './patient';
export * from './clinician';
export * from './screen';
export * from './ownResults';
