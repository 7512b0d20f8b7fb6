import { describe, expect, it } from 'vitest';
import { searchEvidence, searchWords } from '@/lib/evidence/search';
import { DEMO_EVIDENCE } from '@/lib/evidence/demo';

const ids = (query: string) => searchEvidence(DEMO_EVIDENCE, query).map((e) => e.id);

describe('searchEvidence', () => {
  it('gives every entry in order for an empty query', () => {
    expect(ids('')).toEqual(DEMO_EVIDENCE.map((e) => e.id));
    expect(ids('  ,, ')).toEqual(DEMO_EVIDENCE.map((e) => e.id));
  });

  it('needs every word, each the start of a word of the entry', () => {
    expect(ids('heart failure')).toEqual(['demo-workforce-hba1c-heart-failure']);
    expect(ids('HEART')).toEqual(['demo-workforce-hba1c-heart-failure']);
    expect(ids('coron')).toEqual(['demo-nested-case-control-glucose-coronary']);
    expect(ids('art')).toEqual([]);
    expect(ids('heart zebra')).toEqual([]);
  });

  it('searches wording, design, measure and the exposure definition', () => {
    expect(ids('risk set')).toEqual(['demo-nested-case-control-glucose-coronary']);
    expect(ids('nice')).toEqual(['demo-cross-sectional-hba1c-blood-pressure']);
    expect(ids('hr')).toEqual(['demo-workforce-hba1c-heart-failure']);
  });

  it('puts title matches first, then keeps the library order', () => {
    // "prediabetes" is in all three titles; "glucose" only in the second's title.
    expect(ids('prediabetes')).toEqual(DEMO_EVIDENCE.map((e) => e.id));
    expect(ids('glucose')[0]).toBe('demo-nested-case-control-glucose-coronary');
  });

  it('ignores accents and case', () => {
    expect(searchWords('Région HbA1c, risk-set')).toEqual(['region', 'hba1c', 'risk', 'set']);
    const entry = { ...DEMO_EVIDENCE[0]!, id: 'x', title: 'Étude régionale' };
    expect(searchEvidence([entry], 'etude REGION').map((e) => e.id)).toEqual(['x']);
  });
});
