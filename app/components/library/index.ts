/** The library screens (issue 6), for the consultation screen to embed. */
export { LibraryProvider, LibraryStatus, useLibrary, type LibraryState, type LibraryProviderProps } from './LibraryContext';
export { LibraryScreen, type LibraryScreenProps } from './LibraryScreen';
export { TableImport, TablePreview, type TableImportProps } from './TableImport';
export { TableList, type TableListProps } from './TableList';
export { EvidenceLibrary, describeEffect, type EvidenceLibraryProps } from './EvidenceLibrary';
export { EvidenceForm, type EvidenceFormProps } from './EvidenceForm';
export { SaveEvidence, suggestTitle, type SaveEvidenceProps } from './SaveEvidence';
export { ProblemList, type ProblemListProps } from './ProblemList';
