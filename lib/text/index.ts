/** Text in and out: reading typed decimals, trimming, plurals, age phrases, the one locale. */
export * from './locale';
export * from './number';
export * from './plural';
export * from './trim';
export * from './decimal';
export * from './ages';
export * from './case';
export * from './headers';
export * from './significant';
