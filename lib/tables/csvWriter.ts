/** Writing a population table as the CSV file the reader takes (docs/table-format.md). */
import Papa from 'papaparse';
import { guardTextCell } from '../export/spreadsheetCell';
import { DETAIL_KEYS, STRATUM_COLUMN_PREFIX, type DetailKey } from './csvFormat';
import type { PopulationTable, TableForm } from './schema';

function numberCell(n: number): string {
  return String(n);
}

/**
 * Write a table in the same format `parseTableCsv` (csvReader.ts) reads: details, header, one row per
 * stratum in the table's order. Reading the result back gives the same table. Text cells that
 * would start like a spreadsheet formula are written with a leading `'` (lib/export), which the
 * reader takes off again; the `# key: value` detail cells start with `#`, so need no guard.
 */
export function exportTableCsv(table: PopulationTable): string {
  const detailValue: Record<DetailKey, string | undefined> = {
    id: table.id,
    title: table.title,
    outcome: table.outcome,
    horizon_years: table.horizonYears === undefined ? undefined : numberCell(table.horizonYears),
    population: table.population,
    source: table.source,
    year: numberCell(table.year),
    illustrative: table.illustrative ? 'true' : 'false',
    exposure_prevalence: table.exposurePrevalence === undefined ? undefined : numberCell(table.exposurePrevalence),
  };
  const lines: string[] = [];
  for (const key of DETAIL_KEYS) {
    const value = detailValue[key];
    if (value !== undefined) lines.push(Papa.unparse([[`# ${key}: ${value}`]], { newline: '\n' }));
  }
  const form: TableForm = table.strata[0]?.risk !== undefined ? 'risk' : 'rate';
  const keys = Object.keys(table.strata[0]?.extra ?? {}).sort();
  // A stratum's own exposure prevalence (issue 11 item 3): a column only when some stratum has one.
  const withPrevalence = table.strata.some((s) => s.exposurePrevalence !== undefined);
  const header = [
    'sex',
    'age_from',
    'age_to',
    ...keys.map((k) => `${STRATUM_COLUMN_PREFIX}${k}`),
    ...(form === 'risk' ? ['risk'] : ['rate', 'person_years']),
    ...(withPrevalence ? ['exposure_prevalence'] : []),
  ];
  const rows = table.strata.map((s) => [
    guardTextCell(s.sex),
    numberCell(s.ageFrom),
    numberCell(s.ageTo),
    ...keys.map((k) => guardTextCell(s.extra?.[k] ?? '')),
    ...(form === 'risk' ? [numberCell(s.risk ?? Number.NaN)] : [numberCell(s.rate ?? Number.NaN), numberCell(s.perPersonYears ?? Number.NaN)]),
    ...(withPrevalence ? [s.exposurePrevalence === undefined ? '' : numberCell(s.exposurePrevalence)] : []),
  ]);
  // Text cells are guarded so a spreadsheet never runs one as a formula; number cells stay as written.
  lines.push(Papa.unparse([header.map(guardTextCell), ...rows], { newline: '\n' }));
  return `${lines.join('\n')}\n`;
}
