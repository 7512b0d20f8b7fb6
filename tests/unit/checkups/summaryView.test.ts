import { describe, expect, it } from 'vitest';
import { checkupsSummaryView, problemLine, problemsHeading } from '../../../lib/checkups/summaryView';
import { summariseWorkforce } from '../../../lib/workforce/summary';
import { C003, W001, W002 } from './fixtures';

describe('checkupsSummaryView', () => {
  const summary = summariseWorkforce([W001, W002, C003], { read: 10, used: 10, skipped: 0 });
  const view = checkupsSummaryView(summary, 'heart failure');

  it('counts by status in the order of the statuses', () => {
    expect(view.statuses.map((s) => [s.status, s.count])).toEqual([
      ['exposed', 1],
      ['comparison', 1],
      ['neither', 0],
      ['diabetes-range', 0],
      ['insufficient', 1],
    ]);
  });

  it('feeds the chart with the summary’s expected events, one decimal', () => {
    // E1 = 0.0239 (W001's exposed risk) → 0.0; E0 = 0.015 → 0.0 (hand-computed, one decimal)
    expect(view.chart.map((b) => b.events)).toEqual([0, 0]);
    expect(view.chartText).toBe(
      'Among the 1 worker who fit the exposure, 0.0 cases of heart failure are expected over 10 years at their own risk, against 0.0 at the comparison group’s risk: 0.0 more (0.0 to 0.0).',
    );
  });

  it('writes the employer paragraph with counts and no worker id', () => {
    expect(view.employerParagraph.startsWith('Of 3 workers whose checkup results were reviewed, 1 fit the study’s exposure, 1 fit its comparison group, 0 fit neither, 0 had a latest result in the diabetes range (a note for follow-up, not a diagnosis) and 1 had too few results to say.')).toBe(true);
    for (const id of ['W001', 'W002', 'C003']) expect(view.employerParagraph).not.toContain(id);
    expect(view.caution).toBe(summary.caution);
  });

  it('has a table per stratum with one count per status', () => {
    const site = view.strata.find((s) => s.name === 'site');
    expect(site?.rows).toEqual([
      { value: 'North', counts: [1, 1, 0, 0, 0] },
      { value: 'South', counts: [0, 0, 0, 0, 1] },
    ]);
  });
});

describe('row problems', () => {
  it('names the row and the column like the command', () => {
    expect(problemLine({ line: 146, column: 'HbA1c (%)', code: 'out-of-range', message: 'The HbA1c value in % must be between 3 and 20 (got 42)' })).toBe('row 146, column HbA1c (%): The HbA1c value in % must be between 3 and 20 (got 42)');
    expect(problemLine({ line: 3, file: 'Observation.ndjson', column: null, code: 'x', message: 'Not JSON' })).toBe('Observation.ndjson, row 3: Not JSON');
    expect(problemsHeading(2, 2)).toBe('2 row problems (2 rows skipped; the rest were processed)');
    expect(problemsHeading(0, 0)).toBe('No row problems');
  });
});
