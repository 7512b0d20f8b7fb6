/** Readability: syllables, words, sentences, Flesch reading ease and Flesch–Kincaid grade. */
export * from './numberWords';
export * from './syllables';
export * from './words';
export * from './scores';
