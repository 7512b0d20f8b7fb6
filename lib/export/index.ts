/** Writing files for other programs: text cells a spreadsheet shows as text. */
export * from './spreadsheetCell';
