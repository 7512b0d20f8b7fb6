// @vitest-environment jsdom
import '@testing-library/jest-dom/vitest';
import { afterEach, describe, expect, it } from 'vitest';
import { cleanup, render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { designWords } from '@/app/components/library/EvidenceLibrary';
import { EvidenceForm } from '@/app/components/library/EvidenceForm';
import { DEMO_EVIDENCE } from '@/lib/evidence/demo';

afterEach(() => cleanup());

// Issue 12 item 17: the library shows people's words, not internal codes.
describe('the library in people’s words', () => {
  it('names a study design as the consultation form does', () => {
    expect(designWords('risk-set-case-control')).toBe('case-control with risk-set sampling (e.g. nested in a cohort)');
    expect(designWords('cohort')).toBe('cohort');
  });

  it('the edit form offers levels, designs and adjustment in words, never as codes', async () => {
    // The demo nested case-control entry: illustrative, not a real study.
    const entry = DEMO_EVIDENCE.find((e) => e.effect.design === 'risk-set-case-control')!;
    render(<EvidenceForm entry={entry} onSave={async () => []} onCancel={() => {}} />);
    const texts = (label: string) => within(screen.getByLabelText(label)).getAllByRole('option').map((o) => o.textContent);
    // The consultation form's own choice lists (lib/consultation/choices.ts), "not stated" in its words.
    expect(texts('Interval level')).toEqual(['Not stated (95% assumed)', '95%', '90%', '99%']);
    expect(texts('Adjusted')).toEqual(['Not stated', 'Adjusted', 'Unadjusted']);
    expect(texts('Study design')).not.toContain('risk-set-case-control');
    expect(texts('Study design')).toContain('Case-control with risk-set sampling (e.g. nested in a cohort)');
    expect(texts('Measure')).toEqual(['Odds ratio (OR)', 'Risk ratio (RR)', 'Hazard ratio (HR)']);
    // The stored values are unchanged: choosing a word still saves the code.
    await userEvent.selectOptions(screen.getByLabelText('Interval level'), '99%');
    expect(screen.getByLabelText('Interval level')).toHaveValue('0.99');
  });
});
